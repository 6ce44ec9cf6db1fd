/**
 * The invented world of the demo: a small pottery-and-tea shop, "Marrowgate Kiln & Tea", in the
 * invented town of Elsby Wharf. It sells handmade stoneware and loose-leaf tea online, runs clay
 * workshops in its studio, and reads one shared inbox. Every name below is made up for the demo.
 */
import type { Random } from '../server/common/random.js';
import { randomInt } from '../server/common/random.js';

/** The invented shop's name, as customers write it. */
export const SHOP_NAMES = ['Marrowgate Kiln & Tea', 'Marrowgate', 'Marrowgate Kiln', 'the Marrowgate shop'] as const;

const FIRST_NAMES = [
  'Aled', 'Anaïs', 'Bethan', 'Björn', 'Calum', 'Carys', 'Dara', 'Delphine', 'Eliška', 'Emeka', 'Fenella', 'Gideon',
  'Hattie', 'Idris', 'Imogen', 'Jasper', 'Jolene', 'Kofi', 'Lowri', 'Mairéad', 'Marek', 'Nadia', 'Niamh', 'Oona',
  'Perpetua', 'Priya', 'Quentin', 'Rhodri', 'Rosalind', 'Saoirse', 'Siân', 'Tobias', 'Ulla', 'Wilf', 'Yusuf', 'Zoë',
  'Agnieszka', 'Bram', 'Cosima', 'Dmitri', 'Efua', 'Florin', 'Greer', 'Hamish', 'Ines', 'Jude', 'Keturah', 'Leif',
] as const;

const SURNAMES = [
  'Abernathy', 'Ballantyne', 'Caddow', 'Dunstable', 'Elphick', 'Farrant', 'Gethin', 'Hollowell', 'Inchcape',
  'Jessop', 'Kettleborough', 'Llewellin', 'Marchbank', 'Nuttall', 'Okonkwo', 'Pennefather', 'Quarrie', 'Rudd',
  'Stroud', 'Tolley', 'Underhill', 'Varga', 'Winterbottom', 'Yelland', 'Zamora', 'Østergaard', 'Brannigan',
  'Crowther', 'Dewhurst', 'Fairweather', 'Grimshaw', 'Hesketh', 'Lowther', 'Mabey', 'Pryce', 'Sowerby',
] as const;

/** Staff of the invented shop, by the names customers use for them. */
export const STAFF = ['Odile', 'Ravi', 'Bronagh', 'Tomasz', 'Gwen', 'Hollis', 'Marguerite'] as const;

const PRODUCTS = [
  'Heron teapot', 'Saltmarsh mug', 'Ember bowl set', 'Fenlight tumbler', 'Driftwood serving platter',
  'Nightjar espresso cups', 'Reedbed jug', 'Curlew pasta bowls', 'Tidewrack vase', 'Larkrise dinner plates',
  'Moss-glaze planter', 'Pebble salt pig', 'Harrier butter dish', 'Slipware egg cups', 'Kiln-seconds mug',
] as const;

const TEAS = [
  'Smoked Larch', 'Hedgerow Green', 'Harbour Breakfast', 'Quince Oolong', 'Lantern Chai', 'Bramble Rooibos',
  'Fogwater Earl Grey', 'Sea Thrift herbal',
] as const;

const GLAZES = ['celadon', 'tenmoku', 'ash white', 'cobalt speckle', 'iron red', 'sage', 'oatmeal', 'slate blue'] as const;

/** Invented delivery firms. */
export const COURIERS = ['Swiftbarrow Parcels', 'Kestrel Freight', 'Larkpost', 'Tandem Couriers'] as const;

const TOWNS = [
  'Elsby Wharf', 'Coldharbour Ings', 'Brackenmoor', 'Upper Wendle', 'Stilford', 'Kirkby Fallow', 'Ashcombe Vale',
  'Penhallow Cross', 'Netherby Mill', 'Saltcote', 'Dunmere', 'Harlow Fen',
] as const;

const WORKSHOPS = [
  'Wheel Taster evening', 'six-week throwing course', 'Glaze & Fire Saturday', "kids' clay morning",
  'handbuilding afternoon', 'raku weekend', 'teapot masterclass',
] as const;

const WEEKDAYS = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;
const MONTHS = ['March', 'April', 'May', 'June', 'July', 'August', 'September'] as const;

/** Picks one element uniformly. */
export function pick<T>(random: Random, items: readonly T[]): T {
  return items[randomInt(random, items.length)];
}

/** Picks by relative weight; `weights[i]` belongs to `items[i]`. */
export function pickWeighted<T>(random: Random, items: readonly T[], weights: readonly number[]): T {
  let total = 0;
  for (const w of weights) total += w;
  let r = random() * total;
  for (let i = 0; i < items.length; i++) {
    r -= weights[i];
    if (r < 0) return items[i];
  }
  return items[items.length - 1];
}

function digits(random: Random, n: number): string {
  let s = '';
  for (let i = 0; i < n; i++) s += String(randomInt(random, 10));
  return s;
}

function ordinal(n: number): string {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  return `${n}${['th', 'st', 'nd', 'rd'][n % 10] ?? 'th'}`;
}

/** A person invented for one message; the same person signs and is named inside it. */
export interface Persona {
  first: string;
  full: string;
  email: string;
  town: string;
}

/** Invents a customer. E-mail addresses use the reserved example domains (RFC 2606). */
export function inventPersona(random: Random): Persona {
  const first = pick(random, FIRST_NAMES);
  const last = pick(random, SURNAMES);
  const local = `${first}.${last}`.toLowerCase().normalize('NFD').replace(/[^a-z.]/g, '');
  const domain = pick(random, ['example.com', 'example.net', 'example.org']);
  return { first, full: `${first} ${last}`, email: `${local}@${domain}`, town: pick(random, TOWNS) };
}

/**
 * Fills `{slot}` placeholders. Each slot is drawn once per message, so "{order}" written twice in one
 * message names the same order. Unknown slots throw: a typo in a phrase bank must not reach the CSV.
 * @param text a phrase with placeholders
 * @param random seeded source of randomness
 * @param persona the invented writer of the message
 * @param memo slot values already drawn for this message
 */
export function fillSlots(text: string, random: Random, persona: Persona, memo: Map<string, string>): string {
  return text.replace(/\{([a-z]+)\}/g, (_, slot: string) => {
    let value = memo.get(slot);
    if (value === undefined) {
      value = drawSlot(slot, random, persona);
      memo.set(slot, value);
    }
    return value;
  });
}

function drawSlot(slot: string, random: Random, persona: Persona): string {
  switch (slot) {
    case 'first': return persona.first;
    case 'full': return persona.full;
    case 'email': return persona.email;
    case 'town': return persona.town;
    case 'shop': return pick(random, SHOP_NAMES);
    case 'order': return pickWeighted(random, [`MK-${digits(random, 5)}`, `#${digits(random, 5)}`, `MK${digits(random, 5)}`], [6, 3, 1]);
    case 'invoice': return `INV-2026-${digits(random, 4)}`;
    case 'tracking': return `${pick(random, ['SB', 'KF', 'LP', 'TC'])}${digits(random, 9)}GB`;
    case 'product': return pick(random, PRODUCTS);
    case 'other': return pick(random, PRODUCTS);
    case 'tea': return pick(random, TEAS);
    case 'blend': return pick(random, TEAS);
    case 'glaze': return pick(random, GLAZES);
    case 'courier': return pick(random, COURIERS);
    case 'staff':
    case 'greeted': return pick(random, STAFF);
    case 'workshop': return pick(random, WORKSHOPS);
    case 'weekday': return pick(random, WEEKDAYS);
    case 'date':
    case 'otherdate': return pickWeighted(random, [
      `${1 + randomInt(random, 28)} ${pick(random, MONTHS)}`,
      `the ${ordinal(1 + randomInt(random, 28))}`,
      `${pick(random, WEEKDAYS)} the ${ordinal(1 + randomInt(random, 28))}`,
    ], [5, 3, 2]);
    case 'days': return String(3 + randomInt(random, 16));
    case 'count': return String(2 + randomInt(random, 5));
    case 'amount': return `£${10 + randomInt(random, 190)}.${pick(random, ['00', '50', '95', '99', '45', '20'])}`;
    // Ofcom keeps 07700 900000–900999 for fiction, so no real line is printed.
    case 'phone': return `07700 900${digits(random, 3)}`;
    case 'time': return `${8 + randomInt(random, 10)}:${pick(random, ['05', '15', '20', '30', '40', '55'])}`;
    default: throw new Error(`phrase bank uses an unknown slot {${slot}}`);
  }
}
