// /api/rules: the team's rules and the gym's equipment; every coach reads them, the head coach writes.
import { Router } from 'express';
import { teamRulesBody } from '../../../shared/schemas';
import type { AppContext } from '../../context';
import { HEAD_COACH, STAFF, authOf, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import * as service from './rules.service';

export function rulesRouter(ctx: AppContext): Router {
  const router = Router();

  router.get(
    '/rules',
    requireRole(STAFF),
    validate({}, (_input, req) => service.getRules(ctx, authOf(req).teamId)),
  );

  router.put(
    '/rules',
    requireRole(HEAD_COACH),
    validate({ body: teamRulesBody }, ({ body }, req) => service.putRules(ctx, authOf(req), body)),
  );

  return router;
}
