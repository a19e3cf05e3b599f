import { useRef, useState } from 'react';
import { goToPaymentPage } from './redirect';

type CheckoutMutate<V> = (variables: V, callbacks: { onSuccess: (data: { url: string }) => void; onError: () => void }) => void;

/**
 * One payment page per press, however many times the button is pressed: the first press starts the
 * checkout and leaves for the service's page; presses after it do nothing unless the checkout failed.
 */
export function usePaymentHandoff<V>(mutate: CheckoutMutate<V>) {
  const leaving = useRef(false);
  const [redirecting, setRedirecting] = useState(false);
  const start = (variables: V) => {
    if (leaving.current) return;
    leaving.current = true;
    mutate(variables, {
      onSuccess: ({ url }) => {
        setRedirecting(true);
        goToPaymentPage(url);
      },
      onError: () => {
        leaving.current = false;
      },
    });
  };
  return { start, redirecting };
}
