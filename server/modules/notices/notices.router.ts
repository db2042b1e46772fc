// /api/notices: a coach's notices (newest first, unread count), marking them read, the daily e-mail
// setting, and the e-mail's own link that turns the summary off without signing in.
import { Router } from 'express';
import { idParams, noticeListQuery, noticeSettingsBody, unsubscribeQuery } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { linkPage } from '../../services/mail/link-page';
import { verifyDigestToken } from './digest';
import { noticesFor, readAllNotices, readNotice, setDailyEmail, settingsOf } from './notices.service';

const INVALID = ['This link is not valid or has run out. The link in your most recent summary works.'];

export function noticesRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/notices',
    requireRole(STAFF),
    validate({ query: noticeListQuery }, ({ query }, req) => noticesFor(ctx, authOf(req), query)),
  );

  router.put(
    '/notices/read-all',
    requireRole(STAFF),
    validate({}, (_input, req) => readAllNotices(ctx, authOf(req))),
  );

  router.put(
    '/notices/:id/read',
    requireRole(STAFF),
    validate({ params: idParams }, ({ params }, req) => readNotice(ctx, authOf(req), params.id)),
  );

  router.get(
    '/notices/settings',
    requireRole(STAFF),
    validate({}, (_input, req) => settingsOf(ctx, authOf(req).userId)),
  );

  router.put(
    '/notices/settings',
    requireRole(STAFF),
    validate({ body: noticeSettingsBody }, ({ body }, req) => setDailyEmail(ctx, authOf(req).userId, body.dailyEmail)),
  );

  const off = validate({ query: unsubscribeQuery }, async ({ query }, _req, res) => {
    const userId = await verifyDigestToken(ctx.env.SESSION_SECRET, query.token);
    if (!userId) return linkPage(res, 400, 'Link not valid', INVALID);
    await setDailyEmail(ctx, userId, false);
    linkPage(res, 200, 'Daily summaries are off', [
      'You will no longer get the daily e-mail summary of notices. They still appear under Notices in the app, where you can turn the summary back on.',
    ]);
  });
  router.get('/notices/daily-email/off', off);
  // Mail programs' one-click unsubscribe (List-Unsubscribe-Post) posts to the same address.
  router.post('/notices/daily-email/off', off);

  return router;
}
