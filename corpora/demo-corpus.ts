/**
 * The invented demo corpus: about 2,000 messages to the shared inbox of an invented pottery-and-tea
 * shop, over eleven themes of very different sizes, in four languages, with typos, messages that
 * touch two themes, and a few re-sent or forwarded near-duplicates. Pure: no files, no clock.
 */
import type { Channel, DemoMessage, Language, ThemeBank } from './api.js';
import { addTypos, composeEnglish, composeForeign } from './compose.js';
import { DEMO_HEADER } from './demo-info.js';
import { ALL_THEMES, NEIGHBOUR_THEMES } from './themes/all-themes.js';
import { FOREIGN_BANKS, FOREIGN_COURTESIES } from './themes/foreign.js';
import { inventPersona, pick, pickWeighted } from './vocabulary.js';
import type { Random } from '../server/common/random.js';
import { randomInt, seededRandom } from '../server/common/random.js';

/** A table ready for `toCsv`: a header and rows of the same width. */
export interface DemoTable {
  header: string[];
  rows: string[][];
}

const DAY = 86_400_000;
const HOUR = 3_600_000;
/** The invented inbox covers 2 March to 30 August 2026. */
const START = Date.UTC(2026, 2, 2);
const SPAN_DAYS = 182;
/** An invented fortnight of courier trouble in June, so late deliveries bunch up there. */
const COURIER_TROUBLE = Date.UTC(2026, 5, 8);
const COPIES = 25;
/** Chance that a message also touches a second theme. */
const STRAY_RATE = 0.08;
/** Chance, per channel, that a message has typos at all; then chance per long word. */
const TYPO_CHANCE: Readonly<Record<Channel, number>> = { chat: 0.45, 'web form': 0.25, email: 0.2, 'phone note': 0.1 };
const TYPO_RATE = 0.05;

const HOURS = Array.from({ length: 24 }, (_, h) => h);
const OFFICE_HOURS = HOURS.map((h) => (h >= 9 && h <= 17 ? 1 : 0));
const WAKING_HOURS = HOURS.map((h) => (h < 6 ? 0.2 : h < 9 ? 2 : h < 18 ? 5 : h < 23 ? 3 : 1));

function receivedAt(random: Random, channel: Channel, label: string): number {
  const day = label === 'Late delivery' && random() < 0.3
    ? Math.floor((COURIER_TROUBLE - START) / DAY) + randomInt(random, 14)
    : randomInt(random, SPAN_DAYS);
  const officeOnly = channel === 'chat' || channel === 'phone note';
  const hour = pickWeighted(random, HOURS, officeOnly ? OFFICE_HOURS : WAKING_HOURS);
  return START + day * DAY + hour * HOUR + randomInt(random, 3600) * 1000;
}

function pickChannel(random: Random, bank: ThemeBank): Channel {
  const channels = Object.keys(bank.channels) as Channel[];
  return pickWeighted(random, channels, channels.map((c) => bank.channels[c] ?? 0));
}

function pickStray(random: Random, bank: ThemeBank): ThemeBank | null {
  if (random() >= STRAY_RATE) return null;
  const neighbours = NEIGHBOUR_THEMES[bank.label];
  if (!neighbours) return null; // pitches and job applications stay on their one subject
  const label = pick(random, neighbours);
  return ALL_THEMES.find((t) => t.label === label) ?? null;
}

interface Draft extends DemoMessage {
  subject: string;
}

function englishDrafts(random: Random): Draft[] {
  const drafts: Draft[] = [];
  for (const bank of ALL_THEMES) {
    for (let i = 0; i < bank.size; i++) {
      const channel = pickChannel(random, bank);
      const stray = pickStray(random, bank);
      const composed = composeEnglish(random, bank, channel, inventPersona(random), stray);
      const text = random() < TYPO_CHANCE[channel] ? addTypos(random, composed.text, TYPO_RATE) : composed.text;
      drafts.push({
        text, subject: composed.subject, channel, received: receivedAt(random, channel, bank.label),
        language: 'en', theme: bank.label, alsoAbout: stray?.label ?? '', copyOf: -1,
      });
    }
  }
  return drafts;
}

function foreignDrafts(random: Random): Draft[] {
  const drafts: Draft[] = [];
  for (const bank of FOREIGN_BANKS) {
    for (let i = 0; i < bank.size; i++) {
      const channel: Channel = random() < 0.7 ? 'email' : 'web form';
      const text = composeForeign(random, bank, FOREIGN_COURTESIES[bank.language], inventPersona(random));
      drafts.push({
        text, subject: '', channel, received: receivedAt(random, channel, bank.label),
        language: bank.language as Language, theme: bank.label, alsoAbout: '', copyOf: -1,
      });
    }
  }
  return drafts;
}

/** A small edit, as when someone re-sends a message a few days later. */
function touchUp(random: Random, text: string): string {
  const days = /\b(\d{1,2}) days\b/.exec(text);
  if (days) return text.replace(days[0], `${Number(days[1]) + 1 + randomInt(random, 4)} days`);
  return `${text}\n\nAny update on this?`;
}

/** Re-sent and forwarded copies of earlier e-mails and web forms, each marked with its original. */
function copyDrafts(random: Random, originals: readonly Draft[]): Draft[] {
  const eligible: number[] = [];
  originals.forEach((d, i) => { if (d.channel === 'email' || d.channel === 'web form') eligible.push(i); });
  const chosen = new Set<number>();
  while (chosen.size < COPIES) chosen.add(eligible[randomInt(random, eligible.length)]);
  const copies: Draft[] = [];
  for (const i of [...chosen].sort((a, b) => a - b)) {
    const o = originals[i];
    const english = o.language === 'en';
    const kind = english ? pickWeighted(random, ['same', 'apology', 'forward', 'edit'], [3, 3, 2, 3]) : 'same';
    const received = o.received + HOUR + randomInt(random, 4 * 24) * HOUR;
    let text = o.text;
    let subject = o.subject;
    if (kind === 'apology') {
      text = `Sorry, sending this again as I have not had a reply.\n\n${o.text}`;
      subject = subject && `Re: ${subject}`;
    } else if (kind === 'forward') {
      const sent = new Date(o.received).toISOString().slice(0, 16).replace('T', ' ');
      text = `Forwarding this in case it went astray.\n\n----- Original message -----\nSent: ${sent}\n\n${o.text}`;
      subject = subject && `Fwd: ${subject}`;
    } else if (kind === 'edit') {
      text = touchUp(random, o.text);
    }
    copies.push({ ...o, text, subject, received, copyOf: i });
  }
  return copies;
}

/**
 * Generates the invented demo corpus. The same seed always gives the same table, byte for byte.
 * Rows are in order of arrival; `copy_of` names the id of the message a row re-sends, or is empty.
 * @param seed seed for `seededRandom`; the committed file uses `DEMO_SEED`
 */
export function generateDemoCorpus(seed: number): DemoTable {
  if (!Number.isInteger(seed)) throw new TypeError(`seed must be an integer, got ${seed}`);
  const random = seededRandom(seed);
  const originals = [...englishDrafts(random), ...foreignDrafts(random)];
  const all = [...originals, ...copyDrafts(random, originals)];
  const order = all.map((_, i) => i).sort((a, b) => all[a].received - all[b].received || a - b);
  const idOf = new Array<string>(all.length);
  order.forEach((draftIndex, position) => { idOf[draftIndex] = `m${String(position + 1).padStart(4, '0')}`; });
  const rows = order.map((i) => {
    const d = all[i];
    return [
      idOf[i], d.text, d.subject, d.channel, new Date(d.received).toISOString().replace('.000Z', 'Z'), d.language,
      d.theme, d.alsoAbout, d.copyOf >= 0 ? idOf[d.copyOf] : '',
    ];
  });
  return { header: [...DEMO_HEADER], rows };
}
