// Each person's notification history (what Whorl sent them, and how) and their
// choice of delivery: each message as it happens, or one daily digest.
import { z } from 'zod';
import { ListQueryBaseSchema } from './common';

/** Whose messages: the reader's own (default); an administrator may ask for everyone's or one person's. */
export const NotificationListQuerySchema = ListQueryBaseSchema.extend({
  person: z.union([z.literal('me'), z.literal('all'), z.coerce.number().int().positive()]).default('me'),
}).strict();

export const DeliveryPreferenceSchema = z
  .object({
    delivery: z.enum(['immediate', 'daily_digest'], { error: 'choose “as they happen” or “one daily digest”' }),
    version: z.number().int().min(0),
  })
  .strict();

export type NotificationListQuery = z.infer<typeof NotificationListQuerySchema>;
export type DeliveryPreferenceInput = z.infer<typeof DeliveryPreferenceSchema>;
export type Delivery = DeliveryPreferenceInput['delivery'];

/** Where a message stands, in the words the page shows. */
export type NotificationStatus = 'sending' | 'retrying' | 'sent' | 'held_for_digest' | 'sent_in_digest';

export interface NotificationView {
  id: number;
  subject: string;
  /** What kind of message, in words ("Reminder: corrective action overdue"). */
  kindLabel: string;
  recipient: { id: number | null; displayName: string | null; address: string };
  createdAt: string;
  status: NotificationStatus;
  statusLabel: string;
  /** When it left Whorl: on its own, or inside a digest. */
  sentAt: string | null;
  /** The record it is about, as a client path, when it names one. */
  recordPath: string | null;
  text: string;
}

export interface DeliveryView {
  delivery: Delivery;
  /** Hour of the day (UTC) at which digests go out. */
  digestHourUtc: number;
  version: number;
}
