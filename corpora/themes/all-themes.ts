/** The demo's English themes in a fixed order (the order is part of the seeded output). */
import type { ThemeBank } from '../api.js';
import { ACCOUNT_AND_SIGN_IN, INVOICES_AND_BILLING } from './accounts.js';
import { ARRIVED_DAMAGED, LATE_DELIVERY, REFUNDS_AND_RETURNS } from './orders.js';
import { JOB_APPLICATIONS, PRAISE, STAFF_COMPLAINTS } from './people.js';
import { SALES_PITCHES } from './pitches.js';
import { PRODUCT_QUESTIONS, WORKSHOP_BOOKINGS } from './shop.js';

/** Every theme of the invented inbox, largest first. */
export const ALL_THEMES: readonly ThemeBank[] = [
  LATE_DELIVERY, REFUNDS_AND_RETURNS, PRODUCT_QUESTIONS, WORKSHOP_BOOKINGS, INVOICES_AND_BILLING,
  ACCOUNT_AND_SIGN_IN, ARRIVED_DAMAGED, PRAISE, STAFF_COMPLAINTS, SALES_PITCHES, JOB_APPLICATIONS,
];

/**
 * Which second theme a message most plausibly strays into, by label. A parcel that came broken
 * leads to a refund; a double charge leads to an account question. Themes not listed stray anywhere.
 */
export const NEIGHBOUR_THEMES: Readonly<Record<string, readonly string[]>> = {
  'Late delivery': ['Refunds and returns', 'Staff complaints', 'Invoices and billing'],
  'Arrived damaged': ['Refunds and returns', 'Late delivery'],
  'Refunds and returns': ['Invoices and billing', 'Arrived damaged', 'Staff complaints'],
  'Invoices and billing': ['Account and sign-in', 'Refunds and returns'],
  'Account and sign-in': ['Invoices and billing', 'Late delivery'],
  'Product questions': ['Workshop bookings', 'Praise'],
  'Workshop bookings': ['Invoices and billing', 'Product questions', 'Praise'],
  Praise: ['Product questions', 'Workshop bookings'],
  'Staff complaints': ['Refunds and returns', 'Workshop bookings'],
};
