import 'server-only';
export { renderOutOfServiceMail } from './out-of-service-mail';
export { renderBackInServiceMail } from './back-in-service-mail';
export { renderRepairNeededMail } from './repair-needed-mail';
export type { MailDefect, RenderedMail } from './render-mail';
