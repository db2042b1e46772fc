// Every API module's router, mounted under /api in this order.
import type { Router } from 'express';
import type { AppContext } from '../context';
import { authRouter } from './auth/auth.router';
import { bodyweightsRouter } from './bodyweights/bodyweights.router';
import { myWeekRouter } from './my-week/my-week.router';
import { reviewRouter } from './review/review.router';
import { tissueRouter } from './tissue/tissue.router';
import { topSetsRouter } from './top-sets/top-sets.router';
import { videosRouter } from './videos/videos.router';

export const apiModules: ((ctx: AppContext) => Router)[] = [
  authRouter,
  myWeekRouter,
  topSetsRouter,
  videosRouter,
  bodyweightsRouter,
  tissueRouter,
  reviewRouter,
];
