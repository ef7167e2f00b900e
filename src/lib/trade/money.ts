// Invoice arithmetic in integer minor units (pence, cents).
//
// Rounding rule (common practice, and one HMRC accepts for VAT invoices): every line is rounded
// on its own, half up to the minor unit, in this order: quantity × unit price, then the line's
// discount, then the line's tax. Totals are sums of the rounded lines, so the lines on the paper
// always add up to the totals on the paper, to the penny.
import { describe, finite } from './guard';

export const ROUNDING_RULE = 'half-up-per-line' as const;
export const ROUNDING_RULE_TEXT =
  'Each line is rounded half up to the minor unit (quantity × price, then discount, then tax); totals are the sums of the rounded lines (common practice).';

export type PartLineInput = {
  description?: string;
  /** Up to 3 decimals: 4.5 L of oil, 1 filter. */
  quantity: number;
  unitPriceMinor: number;
  discountPercent?: number;
  discountMinor?: number;
  /** Overrides the invoice's rate for this line (e.g. a zero-rated item). */
  taxRatePercent?: number;
};

export type LabourLineInput = {
  description?: string;
  /** Up to 3 decimals; 1.25 is an hour and a quarter. */
  hours: number;
  rateMinor: number;
  discountPercent?: number;
  discountMinor?: number;
  taxRatePercent?: number;
};

export type InvoiceLine = {
  kind: 'part' | 'labour';
  description: string;
  quantity: number;
  unitPriceMinor: number;
  /** quantity × unit price, rounded. */
  amountMinor: number;
  discountMinor: number;
  netMinor: number;
  taxRatePercent: number;
  taxMinor: number;
  totalMinor: number;
};

export type InvoiceTotals = {
  currency: string;
  /** Digits after the decimal point in this currency (2 for GBP, 0 for JPY). */
  minorDigits: number;
  lines: InvoiceLine[];
  /** Sum of the lines before discounts. */
  subtotalMinor: number;
  discountMinor: number;
  netMinor: number;
  taxMinor: number;
  totalMinor: number;
  taxByRate: { ratePercent: number; netMinor: number; taxMinor: number }[];
  rounding: typeof ROUNDING_RULE;
  roundingText: string;
};

// Scales of the decimal inputs: quantities and hours to thousandths, percentages to
// thousandths of a percent (8.875 % sales tax fits). Exact integers from here on.
const QUANTITY_SCALE = 1000n;
const PERCENT_SCALE = 100_000n; // 100 % × 1000

/**
 * Totals of an invoice. `labour` may be one line or several; `taxRatePercent` applies to every
 * line that does not carry its own. Negative amounts, prices that are not whole minor units and
 * discounts larger than their line are refused.
 */
export function invoiceTotals(input: {
  lines?: PartLineInput[];
  labour?: LabourLineInput | LabourLineInput[] | null;
  taxRatePercent: number;
  currency: string;
}): InvoiceTotals {
  const currency = checkCurrency(input?.currency);
  const defaultRate = percent('The tax rate', input.taxRatePercent);
  const labour = input.labour == null ? [] : Array.isArray(input.labour) ? input.labour : [input.labour];
  if (!Array.isArray(input.lines ?? [])) throw new Error('The invoice lines must be a list');
  const lines: InvoiceLine[] = [
    ...(input.lines ?? []).map((l, i) => priceLine('part', `Line ${i + 1}`, l.description, l.quantity, l.unitPriceMinor, l, defaultRate)),
    ...labour.map((l, i) => priceLine('labour', `Labour line ${i + 1}`, l.description, l.hours, l.rateMinor, l, defaultRate)),
  ];
  const sum = (pick: (l: InvoiceLine) => number) => lines.reduce((acc, l) => acc + pick(l), 0);
  const rates = [...new Set(lines.map((l) => l.taxRatePercent))].sort((a, b) => b - a);
  const totals: InvoiceTotals = {
    currency,
    minorDigits: minorDigits(currency),
    lines,
    subtotalMinor: sum((l) => l.amountMinor),
    discountMinor: sum((l) => l.discountMinor),
    netMinor: sum((l) => l.netMinor),
    taxMinor: sum((l) => l.taxMinor),
    totalMinor: sum((l) => l.totalMinor),
    taxByRate: rates.map((ratePercent) => {
      const at = lines.filter((l) => l.taxRatePercent === ratePercent);
      return { ratePercent, netMinor: at.reduce((a, l) => a + l.netMinor, 0), taxMinor: at.reduce((a, l) => a + l.taxMinor, 0) };
    }),
    rounding: ROUNDING_RULE,
    roundingText: ROUNDING_RULE_TEXT,
  };
  for (const key of ['subtotalMinor', 'totalMinor'] as const) {
    if (!Number.isSafeInteger(totals[key])) throw new Error('The invoice total is too large to compute exactly');
  }
  return totals;
}

function priceLine(
  kind: InvoiceLine['kind'],
  name: string,
  description: string | undefined,
  quantityValue: number,
  priceValue: number,
  discounts: { discountPercent?: number; discountMinor?: number; taxRatePercent?: number },
  defaultRate: number,
): InvoiceLine {
  const what = description ? `${name} ("${description}")` : name;
  const quantity = scaled(`${what}: the ${kind === 'labour' ? 'hours' : 'quantity'}`, quantityValue, QUANTITY_SCALE, 3);
  const unitPrice = minorUnits(`${what}: the ${kind === 'labour' ? 'hourly rate' : 'unit price'}`, priceValue);
  const amount = roundHalfUp(quantity * BigInt(unitPrice), QUANTITY_SCALE);

  if (discounts.discountPercent != null && discounts.discountMinor != null) {
    throw new Error(`${what}: give a discount as a percentage or as an amount, not both`);
  }
  let discount = 0n;
  if (discounts.discountPercent != null) {
    const p = scaled(`${what}: the discount %`, percent(`${what}: the discount`, discounts.discountPercent), 1000n, 3);
    discount = roundHalfUp(amount * p, PERCENT_SCALE);
  } else if (discounts.discountMinor != null) {
    discount = BigInt(minorUnits(`${what}: the discount`, discounts.discountMinor));
  }
  if (discount > amount) throw new Error(`${what}: the discount (${discount}) is larger than the line (${amount})`);
  const net = amount - discount;
  const rate = discounts.taxRatePercent == null ? defaultRate : percent(`${what}: the tax rate`, discounts.taxRatePercent);
  const tax = roundHalfUp(net * scaled('tax rate', rate, 1000n, 3), PERCENT_SCALE);
  return {
    kind,
    description: description ?? '',
    quantity: quantityValue,
    unitPriceMinor: unitPrice,
    amountMinor: Number(amount),
    discountMinor: Number(discount),
    netMinor: Number(net),
    taxRatePercent: rate,
    taxMinor: Number(tax),
    totalMinor: Number(net + tax),
  };
}

/** a / b rounded half up, for a ≥ 0 and b > 0: 0.5 of a minor unit goes up (2.5p → 3p). */
export function roundHalfUp(a: bigint, b: bigint): bigint {
  return (2n * a + b) / (2n * b);
}

/** A decimal input as an exact integer at `scale`, refusing more decimals than the scale holds. */
function scaled(name: string, value: number, scale: bigint, places: number): bigint {
  const v = finite(name, value);
  if (v < 0) throw new Error(`${name} cannot be negative (got ${v})`);
  const n = Math.round(v * Number(scale));
  if (Math.abs(n - v * Number(scale)) > 1e-6 * Math.max(1, Math.abs(n))) {
    throw new Error(`${name} has more than ${places} decimal places (got ${v})`);
  }
  if (!Number.isSafeInteger(n)) throw new Error(`${name} is too large (got ${v})`);
  return BigInt(n);
}

function minorUnits(name: string, value: number): number {
  const v = finite(name, value);
  if (!Number.isInteger(v)) throw new Error(`${name} must be whole minor units (pence, cents), got ${v}`);
  if (v < 0) throw new Error(`${name} cannot be negative (got ${v})`);
  if (!Number.isSafeInteger(v)) throw new Error(`${name} is too large (got ${v})`);
  return v;
}

function percent(name: string, value: number): number {
  const v = finite(name, value);
  if (v < 0 || v > 100) throw new Error(`${name} must be between 0 and 100 %, got ${v}`);
  return v;
}

function checkCurrency(code: unknown): string {
  if (typeof code !== 'string' || !/^[A-Z]{3}$/.test(code)) {
    throw new Error(`${describe(code)} is not a currency: use an ISO 4217 code such as GBP, EUR or USD`);
  }
  try {
    new Intl.NumberFormat('en', { style: 'currency', currency: code });
  } catch {
    throw new Error(`${code} is not a currency this device knows`);
  }
  return code;
}

/** Digits after the decimal point for a currency, from the platform's ISO 4217 data. */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency: checkCurrency(currency) }).resolvedOptions().maximumFractionDigits ?? 2;
}

/** Minor units as money for display: formatMoney(12345, 'GBP') → "£123.45". */
export function formatMoney(minor: number, currency: string, locale = 'en-GB'): string {
  const digits = minorDigits(currency);
  return new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(
    finite('The amount', minor) / 10 ** digits,
  );
}
