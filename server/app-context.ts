import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Config } from './config';
import type { Mailer } from './mail/mailer';

/** What every route module and service is built from. One per app instance; no global state. */
export interface AppContext {
  config: Config;
  ds: DataSource;
  mailer: Mailer;
  logger: Logger;
}
