// Every API module's router, mounted under /api in this order.
import type { Router } from 'express';
import type { AppContext } from '../context';
import { authRouter } from './auth/auth.router';

export const apiModules: ((ctx: AppContext) => Router)[] = [authRouter];
