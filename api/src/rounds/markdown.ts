import MarkdownIt from 'markdown-it';

/**
 * The queen's instructions are Markdown. Raw HTML is off, so anything she types between angle
 * brackets shows as text; markdown-it also refuses javascript: and data: links by itself.
 */
const md = new MarkdownIt({ html: false, linkify: true, breaks: true, typographer: false });

const defaultLinkOpen = md.renderer.rules.link_open ?? ((tokens, idx, options, _env, self) => self.renderToken(tokens, idx, options));
md.renderer.rules.link_open = (tokens, idx, options, env, self) => {
  tokens[idx].attrSet('rel', 'noopener noreferrer nofollow');
  tokens[idx].attrSet('target', '_blank');
  return defaultLinkOpen(tokens, idx, options, env, self);
};

export function renderInstructions(markdown: string): string {
  return md.render(markdown);
}

/** A plain-text version for the text part of e-mails: the Markdown itself reads well as text. */
export function instructionsText(markdown: string): string {
  return markdown.replace(/\r\n/g, '\n').trim();
}
