import type { AppLucia } from './auth/lucia';
import type { SignInLimiters } from './auth/rate-limiter';
import type { Config } from './config';
import type { Db } from './models/models';

/** What routes and services need, built once per app (tests build one per file). */
export interface AppContext {
  config: Config;
  db: Db;
  lucia: AppLucia;
  limiters: SignInLimiters;
}
