// /api/messages/threads: a thread per athlete and week between the athlete and the team's coaches.
import { Router } from 'express';
import { sendMessageBody, threadListQuery, threadParams } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { ANY_ROLE, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { listThreads, markThreadRead, readThread, sendMessage } from './messages.service';

export function messagesRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/messages/threads',
    requireRole(ANY_ROLE),
    validate({ query: threadListQuery }, ({ query }, req) => listThreads(ctx, authOf(req), query)),
  );

  router.get(
    '/messages/threads/:athleteId/:week',
    requireRole(ANY_ROLE),
    validate({ params: threadParams }, ({ params }, req) =>
      readThread(ctx, authOf(req), params.athleteId, params.week),
    ),
  );

  router.post(
    '/messages/threads/:athleteId/:week',
    requireRole(ANY_ROLE),
    validate({ params: threadParams, body: sendMessageBody }, async ({ params, body }, req, res) => {
      const { message } = await sendMessage(ctx, authOf(req), params.athleteId, params.week, body);
      res.status(201);
      return message;
    }),
  );

  router.put(
    '/messages/threads/:athleteId/:week/read',
    requireRole(ANY_ROLE),
    validate({ params: threadParams }, ({ params }, req) =>
      markThreadRead(ctx, authOf(req), params.athleteId, params.week),
    ),
  );

  return router;
}
