import { ListQueryBaseSchema } from './common';

export const MailboxListQuerySchema = ListQueryBaseSchema.extend({}).strict();

export interface CaughtMailSummary {
  id: number;
  subject: string;
  from: string | null;
  to: string[];
  receivedAt: string;
  messageId: string | null;
}

export interface CaughtMailView extends CaughtMailSummary {
  text: string | null;
  html: string | null;
}
