import { Form, Formik } from 'formik';
import { useState } from 'react';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import Spinner from 'react-bootstrap/Spinner';
import { TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import type { LedgerRow } from '../api/get-ledger';
import { refundSchema, type RefundInput, type RefundValues } from '../api/refund-invoice';
import { centsToInput, formatMoney, moneyToCents } from '../lib/money';

type RefundDialogProps = {
  row: LedgerRow | null;
  currency: string;
  onHide: () => void;
  onRefund: (row: LedgerRow, input: RefundInput) => Promise<unknown>;
};

/**
 * Two steps: say how much (all that is left, unless she changes it) and why, then read the amount
 * back in words and confirm it.
 */
export function RefundDialog({ row, currency, onHide, onRefund }: RefundDialogProps) {
  const [confirming, setConfirming] = useState<RefundInput | null>(null);
  const titleId = 'refund-title';
  const refundable = row ? Math.max(0, row.grossCents - row.refundedCents) : 0;
  const close = () => {
    setConfirming(null);
    onHide();
  };
  return (
    <Modal show={row !== null} onHide={close} aria-labelledby={titleId} centered>
      {row && (
        <Formik<RefundValues>
          initialValues={{ amount: centsToInput(refundable, currency), reason: '' }}
          validationSchema={refundSchema(currency, refundable)}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            const input: RefundInput = {
              amountCents: moneyToCents(values.amount, currency),
              ...(values.reason.trim() ? { reason: values.reason.trim() } : {}),
            };
            if (!confirming) {
              setConfirming(input);
              return;
            }
            try {
              await onRefund(row, confirming);
              close();
            } catch (error) {
              setConfirming(null);
              applyServerErrors(error, helpers, values, { amountCents: 'amount' });
            }
          }}
        >
          {({ isSubmitting }) => (
            <Form noValidate aria-labelledby={titleId}>
              <Modal.Header closeButton closeLabel="Close without refunding">
                <Modal.Title id={titleId} as="h2" className="h4">
                  Refund {row.memberName}
                </Modal.Title>
              </Modal.Header>
              <Modal.Body>
                <p>
                  {row.label}: paid {formatMoney(row.grossCents, currency)}
                  {row.refundedCents > 0 && <>, of which {formatMoney(row.refundedCents, currency)} is already refunded</>}.
                </p>
                <FormAlert />
                {!confirming ? (
                  <>
                    <TextField
                      name="amount"
                      label={`Amount to refund (${currency})`}
                      inputMode="decimal"
                      autoComplete="off"
                      help={`At most ${formatMoney(refundable, currency)}.`}
                    />
                    <TextareaField name="reason" label="Reason" optional rows={2} help="Kept in the ledger and the audit log." />
                  </>
                ) : (
                  <div className="confirm-step" data-testid="refund-confirm">
                    <p className="fw-bold fs-5 mb-2">
                      Refund {formatMoney(confirming.amountCents, currency)} to {row.memberName}?
                    </p>
                    <p className="mb-0">
                      {row.method === 'card'
                        ? 'The money goes back to the card she paid with. This cannot be undone.'
                        : 'Give the money back to her yourself; Selvage records the refund. This cannot be undone.'}
                    </p>
                  </div>
                )}
              </Modal.Body>
              <Modal.Footer>
                {!confirming ? (
                  <>
                    <Button variant="outline-secondary" onClick={close}>
                      Cancel
                    </Button>
                    <Button type="submit" variant="primary">
                      Continue
                    </Button>
                  </>
                ) : (
                  <>
                    <Button variant="outline-secondary" disabled={isSubmitting} onClick={() => setConfirming(null)}>
                      Go back
                    </Button>
                    <Button type="submit" variant="danger" disabled={isSubmitting} autoFocus>
                      {isSubmitting && <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />}
                      Yes, refund {formatMoney(confirming.amountCents, currency)}
                    </Button>
                  </>
                )}
              </Modal.Footer>
            </Form>
          )}
        </Formik>
      )}
    </Modal>
  );
}
