/** Every port comes from an environment variable with a default, so two clones can run side by side. */
export const ports = {
  app: Number(process.env.PORT ?? 5180),
  pg: Number(process.env.PGPORT ?? 54320),
  smtp: Number(process.env.SMTP_PORT ?? 1025),
  mailWeb: Number(process.env.MAIL_WEB_PORT ?? 1080),
  feed: Number(process.env.FEED_PORT ?? 5190),
  // npm test uses its own cluster and mail catcher, beside a running `npm start`.
  testPg: Number(process.env.TEST_PGPORT ?? 54330),
  testSmtp: Number(process.env.TEST_SMTP_PORT ?? 1026),
  testMailWeb: Number(process.env.TEST_MAIL_WEB_PORT ?? 1081),
  testFeed: Number(process.env.TEST_FEED_PORT ?? 5191),
};
