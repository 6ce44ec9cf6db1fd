/** Invented phrase bank for unsolicited sales offers and junk that reaches the shared inbox. */
import type { ThemeBank } from '../api.js';

/** Cold offers from suppliers and agencies, plus plain spam. */
export const SALES_PITCHES: ThemeBank = {
  label: 'Sales pitches and spam',
  fromCustomer: false,
  size: 65,
  channels: { email: 9, 'web form': 2 },
  subjects: ['Partnership opportunity', 'Boost your rankings', 'Wholesale clay at factory prices',
    'Quick question about your website', 'Exclusive offer for {shop}', 'Re: our call'],
  leads: [
    'We help small businesses like {shop} reach the first page of search results in 30 days.',
    'Our factory supplies stoneware clay and glazes at up to 40% below UK prices.',
    'I noticed your website loads slowly on mobile and could be losing you customers.',
    'We are offering a free trial of our packaging service for e-commerce sellers.',
    'Would you be interested in stocking our bamboo tea accessories in your shop?',
    'Congratulations, your business has been selected for a premium listing in our directory.',
    'Our influencer network can put your mugs in front of 2 million followers.',
    'We buy unwanted kilns and studio equipment for cash, any condition.',
    'I am reaching out with an exclusive offer on merchant card fees for {shop}.',
  ],
  details: [
    'Our clients typically see a 300% increase in traffic.',
    'Minimum order is only 500 units.',
    'This offer is only valid until {date}.',
    'We have worked with over 1,200 brands across Europe.',
    'There is no obligation and no upfront cost.',
    'Click the link below to claim your spot.',
    'I tried calling you on {weekday} but could not get through.',
  ],
  asks: [
    'Can we book a 15-minute call this week?',
    'Reply YES to claim your free audit.',
    'Let me know a good time to talk.',
    'Just reply to this email and I will send our price list.',
    'To stop receiving these emails, reply STOP.',
  ],
  oneLiners: [
    'Increase your sales by 300% - reply for details',
    'Cheap wholesale packaging, free samples!!!',
  ],
};
