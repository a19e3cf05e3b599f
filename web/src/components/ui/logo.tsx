import { useId } from 'react';

type LogoProps = {
  /** Accessible name of the image. */
  title?: string;
  height?: number;
  /** Hide the wordmark, e.g. where space is tight. */
  markOnly?: boolean;
};

/**
 * A strip of teal fabric whose left edge is the selvage: a woven cream band with a
 * fringe and a column of registration dots, followed by the wordmark.
 */
export function Logo({ title = 'Selvage', height = 40, markOnly = false }: LogoProps) {
  const titleId = useId();
  const width = markOnly ? 40 : 168;
  const fringe = [4, 8, 12, 16, 20, 24, 28, 32, 36];
  const dots = [
    { cy: 10, fill: '#A63D2F' },
    { cy: 18, fill: '#C99A2E' },
    { cy: 26, fill: '#1E2430' },
    { cy: 34, fill: '#1D5C63' },
  ];
  return (
    <svg
      role="img"
      aria-labelledby={titleId}
      width={(height / 40) * width}
      height={height}
      viewBox={`0 0 ${width} 40`}
      focusable="false"
    >
      <title id={titleId}>{title}</title>
      <rect x="3" y="2" width="34" height="36" rx="3" fill="#1D5C63" />
      <path d="M17 2 L37 22 M17 12 L37 32 M17 22 L33 38" stroke="#FBF7EF" strokeOpacity="0.35" strokeWidth="1.5" />
      <rect x="3" y="2" width="12" height="36" fill="#FBF7EF" stroke="#1D5C63" strokeWidth="1" />
      {fringe.map((y) => (
        <rect key={y} x="0" y={y - 1} width="5" height="2" rx="1" fill="#1D5C63" />
      ))}
      <line x1="14" y1="2" x2="14" y2="38" stroke="#C99A2E" strokeWidth="2" strokeDasharray="3 2" />
      {dots.map((d) => (
        <circle key={d.cy} cx="9" cy={d.cy} r="2.4" fill={d.fill} />
      ))}
      {!markOnly && (
        <text x="46" y="29" fill="#1E2430" fontSize="25" fontWeight="700" fontFamily="'Atkinson Hyperlegible Next', system-ui, sans-serif">
          Selvage
        </text>
      )}
    </svg>
  );
}
