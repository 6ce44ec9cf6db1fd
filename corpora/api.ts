/**
 * Types for the invented demo corpus: phrase banks per theme and the rows the generator writes.
 *
 * Every business, person, product, place and message behind these types is invented for the demo.
 */

/** How a message reached the invented shop's shared inbox. */
export type Channel = 'email' | 'web form' | 'chat' | 'phone note';

/** Languages the demo writes messages in (ISO 639-1). */
export type Language = 'en' | 'de' | 'es' | 'fr';

/**
 * The phrases one theme is composed from. Each string may hold `{slot}` placeholders that the
 * composer fills with invented names, order numbers, dates and so on (see `fillSlots`).
 */
export interface ThemeBank {
  /** Human-readable theme name, written into the `intended_theme` column. */
  label: string;
  /** How many original (non-copy) messages of this theme to write. */
  size: number;
  /**
   * True when the writer is a customer: the message may carry an order number, a phone number in
   * the signature, and small talk. False for job seekers and salespeople.
   */
  fromCustomer: boolean;
  /** Relative weights of the channels this theme arrives through. */
  channels: Readonly<Partial<Record<Channel, number>>>;
  /** Email subject lines; the composer sometimes puts one on the first line. */
  subjects: readonly string[];
  /** The sentence that says what the message is about. */
  leads: readonly string[];
  /** Supporting sentences: what happened, when, what was tried. */
  details: readonly string[];
  /** What the writer wants done. */
  asks: readonly string[];
  /** Whole messages of a line or two, as typed into a chat box. */
  oneLiners: readonly string[];
}

/** A theme written in another language: fewer phrases, same structure. */
export interface ForeignBank {
  /** Label of the English theme this belongs to (must match a `ThemeBank.label`). */
  label: string;
  language: Exclude<Language, 'en'>;
  /** How many messages of this theme in this language to write. */
  size: number;
  leads: readonly string[];
  details: readonly string[];
  asks: readonly string[];
}

/** Greetings and sign-offs of one language. */
export interface Courtesies {
  openers: readonly string[];
  closers: readonly string[];
}

/** One message before it is written out as a CSV row. */
export interface DemoMessage {
  text: string;
  channel: Channel;
  /** Milliseconds since the Unix epoch, UTC. */
  received: number;
  language: Language;
  theme: string;
  /** A second theme the message also touches, or `''`. */
  alsoAbout: string;
  /** Index (in generation order) of the message this one re-sends or forwards, or -1. */
  copyOf: number;
}
