// /api/webhooks/payments: the payment provider's events. No session: the signature over the raw body
// (checked by the provider's SDK) is what authenticates the caller, so the body is kept as bytes.
import express, { Router } from 'express';
import { rawBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { handlePaymentEvent } from './webhooks.service';

export function webhooksRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/webhooks/payments',
    express.raw({ type: () => true, limit: '1mb' }),
    validate({ body: rawBody }, async ({ body }, req) => {
      const event = ctx.services.payments.verifyEvent(body, req.get('stripe-signature'));
      const outcome = await handlePaymentEvent(ctx, event);
      return { received: true, outcome };
    }),
  );

  return router;
}
