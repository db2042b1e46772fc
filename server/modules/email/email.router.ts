// /api/email: the one-click way out of the weekly plan e-mail (and back in), reached from a signed link
// in the e-mail itself, without signing in. Answers are small HTML pages, since a person opens them.
import { createRequire } from 'node:module';
import { z } from 'zod';
import { Router } from 'express';
import { unsubscribeQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { validate } from '../../middleware/validate';
import { linkPage } from '../../services/mail/link-page';
import { setWeeklyEmail } from './email.repository';
import { verifyUnsubscribeToken } from '../../lib/link-tokens';

const require = createRequire(import.meta.url);
const fontParams = z.object({ weight: z.enum(['400', '700']) });

const INVALID = ['This link is not valid or has run out. The link in your most recent weekly e-mail works.'];

export function emailRouter(ctx: AppContext): Router {
  const router = Router();

  // The pages above are served outside the client bundle, so they get the shipped Barlow files here.
  router.get(
    '/email/font/:weight.woff2',
    validate({ params: fontParams }, ({ params }, _req, res) => {
      res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      res
        .type('font/woff2')
        .sendFile(require.resolve(`@fontsource/barlow/files/barlow-latin-${params.weight}-normal.woff2`));
    }),
  );

  const unsubscribe = validate({ query: unsubscribeQuery }, async ({ query }, _req, res) => {
    const userId = await verifyUnsubscribeToken(ctx.env.SESSION_SECRET, query.token);
    const email = userId ? await setWeeklyEmail(ctx.database.db, userId, false) : null;
    if (!email) return linkPage(res, 400, 'Link not valid', INVALID);
    linkPage(
      res,
      200,
      'Weekly e-mails are off',
      [`${email} will no longer get an e-mail when a week is published. Your week is still in the app under My week.`],
      { label: 'Turn them back on', url: `/api/email/resubscribe?token=${encodeURIComponent(query.token)}` },
    );
  });
  router.get('/email/unsubscribe', unsubscribe);
  // Mail programs' one-click unsubscribe (List-Unsubscribe-Post) posts to the same address.
  router.post('/email/unsubscribe', unsubscribe);

  router.post(
    '/email/resubscribe',
    validate({ query: unsubscribeQuery }, async ({ query }, _req, res) => {
      const userId = await verifyUnsubscribeToken(ctx.env.SESSION_SECRET, query.token);
      const email = userId ? await setWeeklyEmail(ctx.database.db, userId, true) : null;
      if (!email) return linkPage(res, 400, 'Link not valid', INVALID);
      linkPage(res, 200, 'Weekly e-mails are on', [`${email} will get an e-mail again whenever a week is published.`]);
    }),
  );

  return router;
}
