import type { Config } from '../../config';

/** What mail-writing services need to know: where links in mails point. Handed in, never global. */
export interface MailSettings {
  /** Public address of the app without a trailing slash, e.g. https://kerfbook.lab.example. */
  baseUrl: string;
}

/** Used where a caller (mostly a test) passes nothing. */
export const DEFAULT_MAIL_SETTINGS: MailSettings = { baseUrl: 'http://127.0.0.1:4300' };

/** APP_BASE_URL, or the address the server listens on. */
export function mailSettingsOf(config: Pick<Config, 'appBaseUrl' | 'host' | 'port'>): MailSettings {
  const host = config.host === '0.0.0.0' || config.host === '::' ? '127.0.0.1' : config.host;
  return { baseUrl: config.appBaseUrl ?? `http://${host.includes(':') ? `[${host}]` : host}:${config.port}` };
}
