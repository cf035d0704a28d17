// A person's own choice of how Whorl's e-mail reaches them: each message as it
// happens, or everything gathered into one message a day.
import { useEffect, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/states';
import type { Delivery } from '../../../../shared/schemas/notifications';
import { useDelivery, useSetDelivery } from '../api/messages';

const hourText = (hourUtc: number) => `${String(hourUtc).padStart(2, '0')}:00 UTC`;

export function DeliveryChoice() {
  const delivery = useDelivery();
  const save = useSetDelivery();
  const [choice, setChoice] = useState<Delivery | null>(null);
  useEffect(() => {
    if (delivery.data) setChoice(delivery.data.delivery);
  }, [delivery.data]);

  if (delivery.isLoading) return <Loading what="Reading your delivery choice" />;
  if (delivery.error) return <ErrorNotice error={delivery.error} title="Your delivery choice could not be read" />;
  const current = delivery.data!;
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (choice && choice !== current.delivery) save.mutate({ delivery: choice, version: current.version });
  };

  return (
    <form onSubmit={submit} className="rounded-lg border border-ink/10 bg-white p-4" aria-labelledby="delivery-heading">
      <h2 id="delivery-heading" className="font-bold text-ink">
        How you receive messages
      </h2>
      <fieldset className="mt-2 flex flex-col gap-2 text-sm">
        <legend className="sr-only">Delivery</legend>
        <label className="flex items-start gap-2">
          <input type="radio" name="delivery" value="immediate" checked={choice === 'immediate'} onChange={() => setChoice('immediate')} className="mt-1" />
          <span>
            <strong>Each message as it happens</strong>
            <span className="block text-ink-soft">Assignments, returns and reminders reach your inbox within a minute.</span>
          </span>
        </label>
        <label className="flex items-start gap-2">
          <input type="radio" name="delivery" value="daily_digest" checked={choice === 'daily_digest'} onChange={() => setChoice('daily_digest')} className="mt-1" />
          <span>
            <strong>One daily digest</strong>
            <span className="block text-ink-soft">Everything of the day in one message, sent at {hourText(current.digestHourUtc)}. This page shows each message as it arrives.</span>
          </span>
        </label>
      </fieldset>
      <div className="mt-3 flex items-center gap-3">
        <Button type="submit" disabled={save.isPending || choice === current.delivery}>
          {save.isPending ? 'Saving…' : 'Save my choice'}
        </Button>
        {save.isSuccess && choice === current.delivery && (
          <p role="status" className="text-sm text-ink-soft">
            Saved. New messages follow your choice; anything already held waits for the next digest.
          </p>
        )}
      </div>
      {save.error ? <ErrorNotice error={save.error} title="Your choice was not saved" /> : null}
    </form>
  );
}
