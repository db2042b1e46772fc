// Every API module's router, mounted under /api in this order.
import type { Router } from 'express';
import type { AppContext } from '../context';
import { authRouter } from './auth/auth.router';
import { feesRouter } from './fees/fees.router';
import { paymentsRouter } from './payments/payments.router';
import { webhooksRouter } from './webhooks/webhooks.router';
import { athletesRouter } from './athletes/athletes.router';
import { meetsRouter } from './meets/meets.router';
import { rulesRouter } from './rules/rules.router';
import { variantsRouter } from './variants/variants.router';
import { accessoriesRouter } from './accessories/accessories.router';
import { boardRouter } from './board/board.router';
import { plansRouter } from './plans/plans.router';
import { emailRouter } from './email/email.router';
import { invitationsRouter } from './invitations/invitations.router';
import { passwordResetRouter } from './password-reset/password-reset.router';
import { publishingRouter } from './publishing/publishing.router';
import { bodyweightsRouter } from './bodyweights/bodyweights.router';
import { myWeekRouter } from './my-week/my-week.router';
import { reviewRouter } from './review/review.router';
import { tissueRouter } from './tissue/tissue.router';
import { topSetsRouter } from './top-sets/top-sets.router';
import { videosRouter } from './videos/videos.router';
import { weekRouter } from './week/week.router';
import { messagesRouter } from './messages/messages.router';
import { noticesRouter } from './notices/notices.router';
import { eventsRouter } from './events/events.router';

export const apiModules: ((ctx: AppContext) => Router)[] = [
  authRouter,
  variantsRouter,
  accessoriesRouter,
  athletesRouter,
  meetsRouter,
  rulesRouter,
  plansRouter,
  boardRouter,
  passwordResetRouter,
  invitationsRouter,
  publishingRouter,
  emailRouter,
  myWeekRouter,
  topSetsRouter,
  videosRouter,
  bodyweightsRouter,
  tissueRouter,
  weekRouter,
  messagesRouter,
  noticesRouter,
  eventsRouter,
  reviewRouter,
  feesRouter,
  paymentsRouter,
  webhooksRouter,
];
