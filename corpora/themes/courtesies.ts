/** English greetings, sign-offs and asides shared by every theme of the invented inbox. */
import type { Courtesies } from '../api.js';

/** English greetings and sign-offs. */
export const ENGLISH_COURTESIES: Courtesies = {
  openers: ['Hi,', 'Hello,', 'Dear Sir or Madam,', 'Hi there,', 'Good morning,', 'Hello Marrowgate team,',
    'Hi {greeted},', 'To whom it may concern,', 'Hiya,', 'Good afternoon,', 'Dear Marrowgate Kiln & Tea,', 'Morning all,'],
  closers: ['Thanks,', 'Many thanks,', 'Kind regards,', 'Best wishes,', 'Cheers,', 'Regards,', 'Thank you,',
    'Thanks in advance,', 'All the best,', 'Warm regards,'],
};

/** Sentences that belong to no theme: the chatter around the point of a message. */
export const ASIDES: readonly string[] = [
  'Sorry for the long email.',
  'I hope you are all well.',
  'Apologies if this is the wrong address for this.',
  'I tried ringing but nobody picked up.',
  'I am writing from my phone so excuse any mistakes.',
  'My partner placed the order, but I am the one using it.',
  'I did look at the FAQ page first.',
  'Hope the weather is better where you are than here in {town}.',
  'Sorry to bother you with this.',
  'Not sure if anyone reads this inbox at the weekend.',
  'We only found you because a friend has one of your mugs, and I have been meaning to order for ages.',
  'I know you are a small business and I do not want to be difficult, but I have been patient so far.',
  'I run a little guest house in {town} and my guests often ask where the crockery comes from.',
  'It has been a hectic month here with the children off school, so apologies if I missed an email from you.',
];

/** Lines a member of staff writes at the start of a note taken from a call. */
export const PHONE_NOTE_HEADS: readonly string[] = [
  'Call from {full} at {time}.',
  'Phone note ({staff}): {full} rang at {time}.',
  'Voicemail from {first}, left {weekday} at {time}.',
  'Took a call from {full} ({phone}).',
];

/** Lines a member of staff writes at the end of a phone note. */
export const PHONE_NOTE_TAILS: readonly string[] = [
  'Asked for a call back on {phone}.',
  'Said they would prefer an email reply to {email}.',
  'Promised someone would get back to them today.',
  'Caller was calm but wants an answer this week.',
  'No callback needed, just wanted it noted.',
];
