import addressparser from 'nodemailer/lib/addressparser';
import type { EntityManager } from 'typeorm';
import type { AppContext } from '../../lib/context';
import type { OutboxJob } from '../../lib/mail/outbox';
import type { ReferenceData } from '../instruments/reference-data';
import { buildCalendar, type IcsPerson } from '../../lib/calendar/ics';
import { layout, type RenderedMail } from '../../lib/mail/templates';
import { User } from '../users/user.entity';
import type { TimelineBlock } from './timeline-block.entity';

export type BookingMailKind = 'received' | 'approved' | 'declined' | 'cancelled' | 'moved' | 'displaced' | 'reminder';

// Building an Intl.DateTimeFormat costs far more than using one (measured in docs/benchmarks.md): one pair per zone.
const formatters = new Map<string, { day: Intl.DateTimeFormat; time: Intl.DateTimeFormat }>();
function formattersFor(timeZone: string) {
  let f = formatters.get(timeZone);
  if (!f) {
    f = {
      day: new Intl.DateTimeFormat('en-GB', { timeZone, weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' }),
      time: new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }),
    };
    formatters.set(timeZone, f);
  }
  return f;
}

function when(b: { startsAt: Date; endsAt: Date }, timeZone: string): string {
  const { day, time } = formattersFor(timeZone);
  return `${day.format(b.startsAt)}, ${time.format(b.startsAt)}–${time.format(b.endsAt)} (${timeZone})`;
}

const subjects: Record<BookingMailKind, string> = {
  received: 'Beam-time request received',
  approved: 'Beam time confirmed',
  declined: 'Beam-time request declined',
  cancelled: 'Beam time cancelled',
  moved: 'Beam time moved',
  displaced: 'Beam time displaced by maintenance — please rebook',
  reminder: 'Reminder: your beam time starts in 24 hours',
};

/** The address mail is sent from (MAIL_FROM, "Name <address>"), the organiser of every scheduling message. */
const senders = new Map<string, string>();
function senderAddress(mailFrom: string): string {
  let address = senders.get(mailFrom);
  if (address === undefined) {
    address = addressparser(mailFrom, { flatten: true })[0]?.address ?? mailFrom;
    senders.set(mailFrom, address);
  }
  return address;
}

const SAFETY_LINE = 'Class 4 laser: wear eyewear rated for every wavelength on the table at the OD set by the laser-safety officer, and follow their instructions and local rules.';

/** Queues the mail for a booking event through the outbox, in the caller's transaction, with an .ics where it helps. */
export async function queueBookingMail(
  ctx: AppContext, m: EntityManager, kind: BookingMailKind, b: TimelineBlock,
  extra: {
    reason?: string | null; feePercent?: number | null; recipient?: { id: string; email: string; name: string };
    /** The reference data the caller already holds (saves the revision read). */
    reference?: ReferenceData;
    /** Jobs to queue with the mail's own, in one statement. */
    jobs?: OutboxJob[];
  } = {},
): Promise<void> {
  const reference = extra.reference ?? await ctx.reference.get(m);
  const facility = reference.facility;
  const user = extra.recipient?.id === b.userId ? extra.recipient : await m.getRepository(User).findOneByOrFail({ id: b.userId! });
  const cfg = reference.configurations.get(b.configurationId!);
  const instrument = reference.timelines.get(b.instrumentId)?.instrument;
  if (!cfg || !instrument) throw new Error(`booking ${b.id}: configuration or instrument missing from the reference data`);
  const target = b.targetMinNm === b.targetMaxNm ? `${b.targetMinNm} nm` : `${b.targetMinNm}–${b.targetMaxNm} nm`;
  const what = `${instrument.name}, ${cfg.name} at ${target}`;
  const lines = [`Hello ${user.name},`];
  const slot = when(b, facility.timeZone);
  switch (kind) {
    case 'received': lines.push(`Your request for ${what} on ${slot} has reached the facility staff. It holds the slot until they approve or decline it.`); break;
    case 'approved': lines.push(`Your beam time is confirmed: ${what} on ${slot}. The attached calendar entry adds it to your calendar.`, SAFETY_LINE); break;
    case 'declined': lines.push(`Your request for ${what} on ${slot} was declined.`, `Reason: ${extra.reason ?? 'none given'}`); break;
    case 'cancelled': lines.push(`Your beam time ${what} on ${slot} is cancelled.`, `Cancellation fee: ${extra.feePercent ?? 0} % of the booked time (facility policy).`); break;
    case 'moved': lines.push(`Facility staff moved your beam time: ${what} is now on ${slot}. The attached calendar entry updates it.`); break;
    case 'displaced': {
      lines.push(`A maintenance window now covers your beam time ${what} on ${slot}, so it is cancelled at no cost to you.`);
      if (extra.reason) lines.push(`Maintenance: ${extra.reason}`);
      const alternatives = (b.alternatives ?? []).map((a, i) => `${i + 1}. ${when({ startsAt: new Date(a.startsAt), endsAt: new Date(a.endsAt) }, facility.timeZone)}`);
      lines.push(alternatives.length ? `Free slots with the same length and configuration:\n${alternatives.join('\n')}\nRebook one in Femtoslot (Calendar → Needs rebooking).` : 'No free slot of the same length was found in the booking horizon; please contact the facility staff.');
      break;
    }
    case 'reminder': lines.push(`Your beam time starts in about 24 hours: ${what} on ${slot}.`, SAFETY_LINE); break;
  }
  const withCalendar = kind === 'approved' || kind === 'moved' || kind === 'cancelled' || kind === 'displaced';
  const cancelled = kind === 'cancelled' || kind === 'displaced';
  // RFC 5546 §3.2.2 (REQUEST) and §3.2.5 (CANCEL): the facility organises, the booker attends. The booker asked for
  // the slot, so the invitation records them as having accepted and asks for no reply (the app reads none).
  const organizer: IcsPerson = { name: facility.name, email: senderAddress(ctx.env.MAIL_FROM) };
  const attendee = { name: user.name, email: user.email, role: 'REQ-PARTICIPANT' as const, rsvp: false, ...(cancelled ? {} : { partstat: 'ACCEPTED' as const }) };
  const attachments = withCalendar
    ? [{
        filename: cancelled ? 'cancelled-beam-time.ics' : 'beam-time.ics',
        contentType: `text/calendar; charset=utf-8; method=${cancelled ? 'CANCEL' : 'REQUEST'}`,
        content: Buffer.from(buildCalendar([{
          id: b.id, startsAt: b.startsAt, endsAt: b.endsAt, title: `Beam time: ${cfg.name} ${target}`, description: b.purpose ?? '',
          location: `${facility.name} — ${instrument.name}`, status: cancelled ? 'CANCELLED' : 'CONFIRMED', sequence: b.sequence,
          organizer, attendees: [attendee],
        }], cancelled ? 'CANCEL' : 'REQUEST')).toString('base64'),
      }]
    : [];
  const url = `${ctx.env.APP_URL}/calendar`;
  const mail: RenderedMail = {
    template: `booking_${kind}`,
    subject: `${subjects[kind]} — ${cfg.name}, ${slot}`,
    text: `${lines.join('\n\n')}\n\n${url}\n`,
    html: layout(subjects[kind], lines, { label: 'Open the calendar', url }),
  };
  await ctx.outbox.enqueue(m, user.email, mail, attachments, extra.jobs);
}
