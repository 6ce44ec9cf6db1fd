/**
 * Composes one invented message from phrase banks: picks parts, fills slots, shapes the result the
 * way each channel shapes text (chat is terse, e-mail has greetings and paragraphs, phone notes are
 * written by staff), and lets a few typos in.
 */
import type { Channel, Courtesies, ForeignBank, ThemeBank } from './api.js';
import type { Random } from '../server/common/random.js';
import { randomInt } from '../server/common/random.js';
import { ASIDES, ENGLISH_COURTESIES, PHONE_NOTE_HEADS, PHONE_NOTE_TAILS } from './themes/courtesies.js';
import type { Persona } from './vocabulary.js';
import { fillSlots, pick, pickWeighted } from './vocabulary.js';

/** A composed message and, for e-mail, its subject line. */
export interface Composed {
  text: string;
  subject: string;
}

/** Picks `n` distinct items (or all of them when there are fewer). */
function pickDistinct<T>(random: Random, items: readonly T[], n: number): T[] {
  const pool = items.slice();
  const out: T[] = [];
  while (out.length < n && pool.length > 0) out.push(pool.splice(randomInt(random, pool.length), 1)[0]);
  return out;
}

const LOWERABLE = new Set(['The', 'My', 'Our', 'We', 'It', 'This', 'There', 'Your', 'Both', 'Someone', 'Other',
  'When', 'Two', 'Can', 'Could', 'Is', 'Do', 'Are', 'Please', 'Tracking', 'Unfortunately', 'What', 'How', 'Will',
  'Has', 'Have', 'Thank', 'Just', 'Would', 'Any', 'Where', 'Why', 'Are', 'Does', 'Which', 'Minimum', 'References']);

/** Lower-cases the first word when it is an ordinary word, never "I" or a name. */
function lowerFirst(s: string): string {
  const first = /^[A-Za-z]+/.exec(s)?.[0] ?? '';
  return LOWERABLE.has(first) ? s[0].toLowerCase() + s.slice(1) : s;
}

/**
 * A sentence from another theme, worded as the writer's afterthought.
 * @param other the theme the message strays into
 */
function strayInto(random: Random, other: ThemeBank, fill: (s: string) => string): string {
  const sentence = fill(pick(random, random() < 0.6 ? other.leads : other.details));
  const lead = pick(random, ['Also, ', 'P.S. ', 'While I am writing: ', 'One more thing - ', 'Separately, ']);
  return lead === 'Also, ' || lead === 'Separately, ' ? lead + lowerFirst(sentence) : lead + sentence;
}

/**
 * Writes one English message of a theme.
 * @param bank the theme's phrases
 * @param channel how the message arrives; decides its shape
 * @param persona the invented writer
 * @param stray a second theme to mention in passing, or null
 */
export function composeEnglish(
  random: Random,
  bank: ThemeBank,
  channel: Channel,
  persona: Persona,
  stray: ThemeBank | null,
): Composed {
  const memo = new Map<string, string>();
  const fill = (s: string): string => fillSlots(s, random, persona, memo);
  const lead = fill(pick(random, bank.leads));
  const details = (n: number): string[] => pickDistinct(random, bank.details, n).map(fill);
  const ask = (): string => fill(pick(random, bank.asks));
  const extra = stray ? strayInto(random, stray, fill) : '';
  const join = (parts: string[]): string => parts.filter((p) => p !== '').join(' ');

  switch (channel) {
    case 'chat': {
      if (!stray && random() < 0.55) return { text: chatty(random, fill(pick(random, bank.oneLiners))), subject: '' };
      const body = join([lead, random() < 0.5 ? ask() : '', extra]);
      return { text: chatty(random, body), subject: '' };
    }
    case 'web form': {
      const parts = [lead, ...details(randomInt(random, 3)), ask(), extra];
      const text = join(parts) + (bank.fromCustomer && random() < 0.3 ? `\nOrder number: ${fill('{order}')}` : '');
      return { text, subject: '' };
    }
    case 'phone note': {
      const head = fill(pick(random, PHONE_NOTE_HEADS));
      const says = join([lead, ...details(randomInt(random, 2)), extra]);
      return { text: `${head} Says: "${says}" ${fill(pick(random, PHONE_NOTE_TAILS))}`, subject: '' };
    }
    case 'email':
      return { text: email(random, bank, fill, lead, details, ask, extra, ENGLISH_COURTESIES, persona), subject: fill(pick(random, bank.subjects)) };
  }
}

function email(
  random: Random,
  bank: ThemeBank,
  fill: (s: string) => string,
  lead: string,
  details: (n: number) => string[],
  ask: () => string,
  extra: string,
  courtesies: Courtesies,
  persona: Persona,
): string {
  const opener = fill(pick(random, courtesies.openers));
  const closer = pick(random, courtesies.closers);
  const signer = random() < 0.5 ? persona.first : persona.full;
  const shape = pickWeighted(random, ['short', 'medium', 'long'], [35, 42, 23]);
  const aside = (): string => (bank.fromCustomer && random() < 0.5 ? fill(pick(random, ASIDES)) : '');
  const join = (parts: string[]): string => parts.filter((p) => p !== '').join(' ');
  let paragraphs: string[];
  if (shape === 'short') {
    paragraphs = [join([lead, ask(), extra])];
  } else if (shape === 'medium') {
    paragraphs = [join([lead, ...details(1 + randomInt(random, 2))]), join([ask(), extra])];
  } else {
    const ds = details(4 + randomInt(random, 3));
    const cut = 1 + randomInt(random, ds.length - 1);
    paragraphs = [join([aside(), lead, ...ds.slice(0, cut)]), join([...ds.slice(cut), aside()]), join([extra, ask(), aside()])];
  }
  const signature = shape === 'long' && bank.fromCustomer && random() < 0.5
    ? `${signer}\n${fill('{phone}')}`
    : signer;
  const greeting = random() < 0.85 ? `${opener}\n\n` : '';
  return `${greeting}${paragraphs.filter((p) => p !== '').join('\n\n')}\n\n${closer}\n${signature}`;
}

/**
 * Writes one message in another language. Foreign messages arrive by e-mail or web form.
 * @param courtesies greetings and sign-offs of the bank's language
 */
export function composeForeign(random: Random, bank: ForeignBank, courtesies: Courtesies, persona: Persona): string {
  const memo = new Map<string, string>();
  const fill = (s: string): string => fillSlots(s, random, persona, memo);
  const body = [fill(pick(random, bank.leads)), ...pickDistinct(random, bank.details, randomInt(random, 3)).map(fill),
    fill(pick(random, bank.asks))].join(' ');
  return `${pick(random, courtesies.openers)}\n\n${body}\n\n${pick(random, courtesies.closers)}\n${persona.full}`;
}

/** Chat text: often lower-case, often without the final full stop. */
function chatty(random: Random, s: string): string {
  let out = s;
  if (random() < 0.35) out = out.toLowerCase();
  if (random() < 0.4) out = out.replace(/\.$/, '');
  return out;
}

/**
 * Lets typos into a text: in a fraction of words of four letters or more, two letters swap, one
 * drops, or one doubles. Only plain words are touched, so order numbers and addresses stay intact.
 * @param rate chance per eligible word
 */
export function addTypos(random: Random, text: string, rate: number): string {
  return text.replace(/(?<=^|\s)([A-Za-z]{4,})(?=[,.!?]?(?:\s|$))/g, (word: string) => {
    if (random() >= rate) return word;
    const i = 1 + randomInt(random, word.length - 2);
    switch (randomInt(random, 3)) {
      case 0: return word.slice(0, i) + word[i + 1] + word[i] + word.slice(i + 2);
      case 1: return word.slice(0, i) + word.slice(i + 1);
      default: return word.slice(0, i) + word[i] + word.slice(i);
    }
  });
}
