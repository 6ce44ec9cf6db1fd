/** Invented phrase banks for messages about people: thanks, complaints about staff, job seekers. */
import type { ThemeBank } from '../api.js';

/** Thanks and compliments. */
export const PRAISE: ThemeBank = {
  label: 'Praise',
  fromCustomer: true,
  size: 120,
  channels: { email: 5, 'web form': 3, chat: 3, 'phone note': 1 },
  subjects: ['Thank you!', 'Lovely teapot', 'Just wanted to say', 'Great workshop', 'Happy customer'],
  leads: [
    'I just wanted to say how much I love the {product} I bought from you.',
    'Thank you so much for the {workshop} on {weekday}, we had a wonderful time.',
    'The {tea} is the best tea I have had in years.',
    'What a lovely surprise to find a handwritten note in my parcel.',
    'Please pass on my thanks to {staff}, who was so patient with my questions.',
    'My mum cried when she opened the {product}, it is beautiful.',
    'I have been buying from you for three years and you never disappoint.',
    'The packaging was gorgeous and completely plastic-free, thank you.',
    'Thank you for sorting out my order so quickly after the mix-up.',
  ],
  details: [
    'The {glaze} glaze is even nicer in real life than in the photos.',
    'It arrived a day early and beautifully wrapped.',
    '{staff} went out of their way to help us.',
    'My bowl from the class came out of the kiln perfectly.',
    'I have already recommended you to everyone at work.',
    'It is the first thing I use every morning.',
    'We will definitely be back for the {workshop}.',
    'You can tell every piece has been made with care.',
  ],
  asks: [
    'Keep up the great work!',
    'Thanks again, all of you.',
    'Feel free to use this as a review.',
    'I will be ordering again soon.',
    'Have a lovely weekend.',
  ],
  oneLiners: [
    'love my new mug, thank you!! 😊',
    'Thanks {staff} for your help today!',
    'The teapot is gorgeous, thank you.',
    'Best pottery class ever, thanks all',
    'Just a quick thank you for the lovely parcel',
    '{tea} is amazing, ordering more',
  ],
};

/** Complaints about how a member of staff behaved. A small theme that matters. */
export const STAFF_COMPLAINTS: ThemeBank = {
  label: 'Staff complaints',
  fromCustomer: true,
  size: 80,
  channels: { email: 6, 'web form': 3, chat: 1, 'phone note': 2 },
  subjects: ['Complaint about a member of staff', 'Rude service', 'Disappointed with how I was treated',
    'Formal complaint'],
  leads: [
    'I want to complain about the way I was spoken to in your shop on {date}.',
    'The member of staff on the phone, I think {staff}, was extremely rude to me.',
    'I was ignored for ten minutes at the counter while two staff chatted.',
    'The tutor on the {workshop} was dismissive and made my daughter feel stupid.',
    'When I asked about my refund, {staff} hung up on me.',
    'The person who answered your chat told me it was "not their problem".',
    'I was made to feel like a thief when I asked to check a chipped mug in the shop.',
    'Your delivery driver was aggressive when I asked him to wait while I found my keys.',
  ],
  details: [
    'I have been a loyal customer for years and have never been treated like this.',
    'Other customers noticed and one of them apologised to me on your behalf.',
    'I was polite the whole time and did not raise my voice.',
    'It happened at about {time} on {weekday}.',
    'When I asked for a manager I was told there was nobody available.',
    'I have spent over {amount} with you this year.',
    'My friend who was with me can confirm what happened.',
    'It is not the first time: the same thing happened on {otherdate}.',
  ],
  asks: [
    'I would like an apology.',
    'Please could a manager contact me.',
    'I expect this to be taken seriously.',
    'I would like to know what you will do about it.',
    'Please make sure it does not happen to anyone else.',
  ],
  oneLiners: [
    'The woman on your phone line was really rude to me today.',
    'Very unhappy with how staff treated me in the shop',
    'your chat person was rude and unhelpful',
    'Want to make a complaint about a staff member',
  ],
};

/** People asking for work, placements and apprenticeships. */
export const JOB_APPLICATIONS: ThemeBank = {
  label: 'Job applications',
  fromCustomer: false,
  size: 55,
  channels: { email: 9, 'web form': 2 },
  subjects: ['Job application', 'Studio assistant vacancy', 'CV attached', 'Work experience',
    'Weekend shop job', 'Apprenticeship enquiry'],
  leads: [
    'I would like to apply for the studio assistant job advertised on your website.',
    'Please find my CV attached for the weekend shop assistant position.',
    'I am a ceramics graduate and would love to work with you, even part-time.',
    'Do you take students for work experience? I am in Year 10 at {town} Academy.',
    'I saw your poster asking for help in the packing room and would like to apply.',
    'Are you taking on an apprentice potter this year?',
    'I am writing to ask whether you have any vacancies for a part-time tea blender.',
  ],
  details: [
    'I have two years of experience throwing on the wheel and some kiln loading.',
    'I worked in a café for three years, so I am used to busy weekends and tills.',
    'I am available from {date} and can work weekends.',
    'My portfolio is at {full} Ceramics on the usual social sites.',
    'I live in {town}, about twenty minutes away by bus.',
    'I have a full driving licence if deliveries are part of the role.',
    'References are available on request.',
  ],
  asks: [
    'I would be grateful if you would consider my application.',
    'I would welcome the chance to come in for a trial day.',
    'Please let me know if you need anything else from me.',
    'I look forward to hearing from you.',
  ],
  oneLiners: [
    'Hi are you hiring at the moment?',
    'Do you need any weekend staff?',
  ],
};
