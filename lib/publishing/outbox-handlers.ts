import 'server-only';
import type { DoiClientOptions } from '@/lib/doi/client';
import { MAIL_TOPIC } from '@/lib/notify/mail-jobs';
import { sendQueuedMail, type MailTransportOptions } from '@/lib/notify/send-queued-mail';
import type { OutboxHandlers } from '@/lib/outbox/process-outbox';
import { doiRegistrar } from './doi-registrar';
import { DOI_REGISTER_TOPIC, handleDoiRegister } from './register-version-doi';

export type PublishingHandlerOptions = {
  /** Another DOI agency endpoint or credentials than DOI_API_URL (e.g. a closed port in tests). */
  doiApi?: DoiClientOptions;
  /** Another SMTP relay than SMTP_URL. */
  mail?: MailTransportOptions;
};

/** The outbox jobs of publishing: DOI registration and notification mail. */
export function publishingOutboxHandlers(options: PublishingHandlerOptions = {}): OutboxHandlers {
  return {
    [DOI_REGISTER_TOPIC]: (payload) => handleDoiRegister(payload, doiRegistrar(options.doiApi)),
    [MAIL_TOPIC]: (payload) => sendQueuedMail(payload, options.mail),
  };
}
