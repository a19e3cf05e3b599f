import { Form, Formik } from 'formik';
import { useRef, useState } from 'react';
import Button from 'react-bootstrap/Button';
import { ErrorAlert } from '@/components/ui/error-alert';
import { SelectField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { formatMonth } from '@/lib/dates';
import { isEditableMonth, type Bee } from '../api/get-bee';
import { newSeed, useSetRotation } from '../api/set-rotation';
import { swapMonthsSchema, useSwapMonths, type SwapMonthsValues } from '../api/swap-months';

type ToolsProps = { guildId: string; bee: Bee; thisMonth: string };

/** The queen order the organiser starts from: queens of the months ahead, then makers without a month. */
export function initialOrder(bee: Bee, thisMonth: string): { membershipId: number; name: string }[] {
  const seen = new Set<number>();
  const order: { membershipId: number; name: string }[] = [];
  for (const row of bee.rotation) {
    if (!isEditableMonth(row, thisMonth) || row.skipped || !row.queen || seen.has(row.queen.membershipId)) continue;
    seen.add(row.queen.membershipId);
    order.push(row.queen);
  }
  for (const m of bee.members) {
    if ((m.status === 'active' || m.status === 'organiser') && !seen.has(m.membershipId)) {
      seen.add(m.membershipId);
      order.push({ membershipId: m.membershipId, name: m.name });
    }
  }
  if (!seen.has(bee.organiser.membershipId)) order.push(bee.organiser);
  return order;
}

export function ShuffleRotation({ guildId, bee }: ToolsProps) {
  const setRotation = useSetRotation(guildId, String(bee.id));
  const [done, setDone] = useState('');
  const shuffled = bee.seed !== null && bee.seed !== undefined && bee.seed !== '';
  return (
    <div>
      <p>Let Selvage draw the queen order at random for the months ahead. This month and past months stay as they are.</p>
      <ErrorAlert error={setRotation.error} />
      <div className="d-flex flex-wrap gap-2">
        <Button
          variant={shuffled ? 'outline-primary' : 'primary'}
          disabled={setRotation.isPending}
          onClick={() => {
            setDone('');
            setRotation.mutate(shuffled ? { mode: 'shuffle', seed: newSeed() } : { mode: 'shuffle' }, {
              onSuccess: () => setDone('The queen order has been shuffled. The table below shows the new order.'),
            });
          }}
        >
          {shuffled ? 'Shuffle again' : 'Shuffle the queen order'}
        </Button>
      </div>
      <p role="status" aria-live="polite" className={done ? 'mt-2 mb-0' : 'visually-hidden'}>
        {done}
      </p>
    </div>
  );
}

export function ManualOrder({ guildId, bee, thisMonth, onSaved }: ToolsProps & { onSaved?: (message: string) => void }) {
  const setRotation = useSetRotation(guildId, String(bee.id));
  const [order, setOrder] = useState(() => initialOrder(bee, thisMonth));
  const [announcement, setAnnouncement] = useState('');
  const buttons = useRef(new Map<string, HTMLButtonElement | null>());

  const move = (index: number, delta: -1 | 1) => {
    const target = index + delta;
    if (target < 0 || target >= order.length) return;
    const next = [...order];
    const [item] = next.splice(index, 1);
    next.splice(target, 0, item);
    setOrder(next);
    setAnnouncement(`${item.name} is now number ${target + 1} of ${next.length}.`);
    // Keep the focus on the same button of the moved maker, or its other button at the ends.
    const direction = delta < 0 ? 'up' : 'down';
    const other = delta < 0 ? 'down' : 'up';
    requestAnimationFrame(() => {
      const atEnd = delta < 0 ? target === 0 : target === next.length - 1;
      buttons.current.get(`${item.membershipId}-${atEnd ? other : direction}`)?.focus();
    });
  };

  return (
    <div>
      <p>
        Put the makers in the order they will be queen, from next month on. Everyone gets a turn before anyone has a second one.
      </p>
      <ol className="manual-order" aria-label="Queen order">
        {order.map((person, index) => (
          <li key={person.membershipId} className="d-flex flex-wrap align-items-center gap-2 border-bottom py-2">
            <span className="flex-grow-1">
              <span className="order-number" aria-hidden="true">
                {index + 1}.
              </span>{' '}
              {person.name}
            </span>
            <span className="d-flex gap-2">
              <Button
                ref={(el: HTMLButtonElement | null) => {
                  buttons.current.set(`${person.membershipId}-up`, el);
                }}
                variant="outline-primary"
                size="sm"
                disabled={index === 0}
                onClick={() => move(index, -1)}
              >
                Up<span className="visually-hidden">: move {person.name} earlier</span>
              </Button>
              <Button
                ref={(el: HTMLButtonElement | null) => {
                  buttons.current.set(`${person.membershipId}-down`, el);
                }}
                variant="outline-primary"
                size="sm"
                disabled={index === order.length - 1}
                onClick={() => move(index, 1)}
              >
                Down<span className="visually-hidden">: move {person.name} later</span>
              </Button>
            </span>
          </li>
        ))}
      </ol>
      <p role="status" aria-live="polite" className="visually-hidden">
        {announcement}
      </p>
      <ErrorAlert error={setRotation.error} />
      <div className="d-flex flex-wrap gap-2">
        <Button
          variant="primary"
          disabled={setRotation.isPending}
          onClick={() => {
            setAnnouncement('');
            setRotation.mutate(
              { mode: 'manual', order: order.map((p) => p.membershipId) },
              {
                // This list is re-drawn from the saved plan, so the parent announces the result.
                onSuccess: () => onSaved?.('The queen order has been saved. The table shows the months ahead.'),
              },
            );
          }}
        >
          Save this order
        </Button>
        <Button
          variant="outline-secondary"
          disabled={setRotation.isPending}
          onClick={() => {
            setOrder(initialOrder(bee, thisMonth));
            setAnnouncement('The order is back to the current plan.');
          }}
        >
          Start over
        </Button>
      </div>
    </div>
  );
}

export function SwapMonths({ guildId, bee, thisMonth }: ToolsProps) {
  const swap = useSwapMonths(guildId, String(bee.id));
  const months = bee.rotation.filter((r) => isEditableMonth(r, thisMonth));
  const options = months.map((r) => ({
    value: r.month,
    label: `${formatMonth(r.month)}: ${r.skipped ? 'skipped' : (r.queen?.name ?? 'no queen')}`,
  }));
  const initialValues: SwapMonthsValues = { monthA: '', monthB: '' };
  if (options.length < 2) return <p>There are not two months ahead to swap.</p>;
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={swapMonthsSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await swap.mutateAsync(values);
          helpers.resetForm({
            values: initialValues,
            status: { success: `${formatMonth(values.monthA)} and ${formatMonth(values.monthB)} have swapped queens.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Swap two months">
        <FormAlert />
        <p>For when a queen cannot take her month: swap it with another month from next month on.</p>
        <SelectField name="monthA" label="First month" options={options} placeholder="Choose a month" />
        <SelectField name="monthB" label="Second month" options={options} placeholder="Choose a month" />
        <SubmitButton busyLabel="Swapping">Swap these months</SubmitButton>
      </Form>
    </Formik>
  );
}
