import { useId, useState } from 'react';
import Button from 'react-bootstrap/Button';
import type { SizeCheck } from '../api/get-size-checks';
import { SizeCheckPanel, type SizeCheckPanelProps } from './size-check-panel';
import { SizeCheckSummary } from './size-check-result';

type BlockSizeCheckProps = Omit<SizeCheckPanelProps, 'latest' | 'makerName' | 'headingLevel'> & {
  makerName: string;
  latest: SizeCheck | null | undefined;
  /** The organiser may check the size on the maker's behalf. */
  canCheckOnBehalf: boolean;
};

/** In a maker's card in the queen's grid: the latest check, and for the organiser a way to add one. */
export function BlockSizeCheck({ makerName, latest, canCheckOnBehalf, ...panel }: BlockSizeCheckProps) {
  const id = useId();
  const [open, setOpen] = useState(false);
  return (
    <div className="block-size-check mt-2">
      <SizeCheckSummary check={latest} makerName={makerName} />
      {canCheckOnBehalf && (
        <>
          <Button
            variant="outline-primary"
            className="mt-2"
            aria-expanded={open}
            aria-controls={`${id}-panel`}
            onClick={() => setOpen((value) => !value)}
          >
            {open ? 'Close the size check' : 'Check the size for her'}
            <span className="visually-hidden"> ({makerName})</span>
          </Button>
          <div id={`${id}-panel`} hidden={!open} className="mt-3">
            {open && <SizeCheckPanel {...panel} latest={latest} makerName={makerName} headingLevel={4} />}
          </div>
        </>
      )}
    </div>
  );
}
