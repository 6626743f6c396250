/*
 * Event-driven mail (drift alerts, calibration due, overdue work): a source reports events,
 * and this decides who gets which message. Pure: subscriptions and events in, messages out.
 */

export type MailEvent<P> = {
  /** Stable name of the event, e.g. "alert:42" or "calibration:7:2027-01-31:30d". */
  key: string;
  /** Everyone subscribed to the kind, or only these users (if they are subscribed). */
  audience: "subscribers" | readonly string[];
  props: P;
};

export type Subscriber = { userId: string; enabled: boolean };

export type EventMessage<P> = { userId: string; eventKey: string; props: P };

export function eventMessages<P>(events: readonly MailEvent<P>[], subscribers: readonly Subscriber[]): EventMessage<P>[] {
  const enabled = new Set(subscribers.filter((s) => s.enabled).map((s) => s.userId));
  const out: EventMessage<P>[] = [];
  for (const e of events) {
    const who = e.audience === "subscribers" ? [...enabled] : e.audience.filter((u) => enabled.has(u));
    for (const userId of new Set(who)) out.push({ userId, eventKey: e.key, props: e.props });
  }
  return out;
}
