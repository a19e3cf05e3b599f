import { formatInches, parseInches } from '@/lib/inches';
import type { Size } from '../api/get-round';

export const sizeText = (size: Pick<Size, 'widthText' | 'heightText'>) => `${size.widthText} x ${size.heightText} in`;

/** Both sizes, each saying which it is: finished (in the quilt) and unfinished (as cut, with seam allowances). */
export function SizePair({ finished, unfinished, id }: { finished: string; unfinished: string; id?: string }) {
  return (
    <div className="size-pair" id={id}>
      <p className="size-figure mb-0">
        <span className="size-label">Finished size</span> <strong className="size-value">{finished}</strong>
        <span className="size-note">as it shows in the quilt</span>
      </p>
      <p className="size-figure mb-0">
        <span className="size-label">Unfinished (cut) size</span> <strong className="size-value">{unfinished}</strong>
        <span className="size-note">with the seam allowance on every side</span>
      </p>
    </div>
  );
}

/** Live preview while typing: finished + 2 × seam allowance, to the nearest 1/8 inch. */
export function sizePreview(width: string, height: string, seam: string): { finished: string; unfinished: string } | null {
  const w = parseInches(width);
  const h = parseInches(height);
  const s = parseInches(seam || '1/4');
  if (w === null || h === null || s === null || w <= 0 || h <= 0) return null;
  return {
    finished: `${formatInches(w)} x ${formatInches(h)} in`,
    unfinished: `${formatInches(w + 2 * s)} x ${formatInches(h + 2 * s)} in`,
  };
}
