import type { AppConfig } from './config';
import { DEMO_PASSWORD, DEMO_USERS } from './seed/demo';

/** The one banner of `npm start`: where the app is, a demo sign-in, where e-mail goes. */
export function startBanner(url: string, config: Pick<AppConfig, 'smtpUrl'>): string[] {
  const admin = DEMO_USERS.find((u) => u.admin) ?? DEMO_USERS[0];
  const mail = config.smtpUrl
    ? `E-mail:   sent through ${new URL(config.smtpUrl).host}`
    : `E-mail:   kept by the built-in catcher; read it in the Outbox (${url}/outbox, signed in as a site admin)`;
  return [
    '',
    `Gatefold is running at ${url}`,
    `Demo:     ${admin.email} / ${DEMO_PASSWORD} (site admin; seeded on a new database, the other accounts are in README.md)`,
    mail,
    'Stop:     Ctrl+C',
    '',
  ];
}
