// How many minor units a currency has (2 for GBP, 0 for JPY), from ISO 4217 as Intl knows it.
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
}
