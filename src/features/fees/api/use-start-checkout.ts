// Start paying a plan: the server opens the provider's hosted checkout and the browser goes there.
// Nothing about the card passes through Rackturn.
import { useMutation } from '@tanstack/react-query';
import type { CheckoutStart } from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

/** Leaves the app for the provider's page; a separate function so it is clear the page unloads. */
function goTo(url: string) {
  window.location.assign(url);
}

export function useStartCheckout() {
  return useMutation({
    /** Without an athlete id the signed-in athlete pays their own fee; with one, the head coach starts it for them. */
    mutationFn: ({ planId, athleteId }: { planId: number; athleteId?: number }) =>
      api<CheckoutStart>(athleteId === undefined ? '/my-fee/checkout' : `/fees/athletes/${athleteId}/checkout`, {
        method: 'POST',
        body: { planId },
      }),
    onSuccess: (start) => goTo(start.url),
  });
}
