import { NAME, NOTES } from './common-fields';
import type { FieldCatalogue } from './field-spec';

// A customer of the shop: whose vehicle it is, and how to reach them. A vehicle without a
// customer is the shop's own.
export const CUSTOMER_FIELDS = {
  name: NAME,
  contact: { type: 'text', label: 'Contact', hint: 'phone, e-mail or how they like to be reached', maxLength: 200, fallback: '' },
  notes: NOTES,
} as const satisfies FieldCatalogue;
