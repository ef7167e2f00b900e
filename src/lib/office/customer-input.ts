// What the office types about a customer. The same schema checks the form in the browser and
// the body at the endpoint.
import { z } from 'zod';
import { optionalText } from './form-values';

export const customerInput = z.object({
  name: z.string().trim().min(1, 'needs a name').max(120, 'must be at most 120 characters'),
  email: optionalText(200)
    .refine((value) => value === null || z.email().safeParse(value).success, 'is not an e-mail address')
    .transform((value) => value?.toLowerCase() ?? null),
  phone: optionalText(40).refine((value) => value === null || /^[+0-9 ()-]{6,40}$/.test(value), 'use digits, spaces, + ( ) and -'),
  addressLines: z.string().trim().max(300, 'must be at most 300 characters'),
  postcode: z.string().trim().max(12, 'must be at most 12 characters').transform((value) => value.toUpperCase()),
  notes: z.string().trim().max(2000, 'must be at most 2000 characters'),
});

export type CustomerInput = z.output<typeof customerInput>;
export type CustomerFormValues = z.input<typeof customerInput>;

export const CUSTOMER_SORTS = ['name', 'postcode', 'vehicles', 'lastVisit', 'createdAt'] as const;
