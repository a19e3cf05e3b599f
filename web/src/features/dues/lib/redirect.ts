/** Leaves Selvage for the payment service's own page (a full page load, not a route change). */
export function goToPaymentPage(url: string): void {
  window.location.assign(url);
}
