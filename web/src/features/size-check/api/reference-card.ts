export type CardPaper = 'letter' | 'a4';

/** The printable reference card (a PDF the browser opens itself). */
export const referenceCardHref = (paper: CardPaper) => `/api/size-check/card.pdf?paper=${paper}`;
