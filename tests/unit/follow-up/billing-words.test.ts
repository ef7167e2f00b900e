import { describe, expect, it } from 'vitest';
import { formatDocumentNumber } from '../../../src/lib/billing/document-numbers';
import { invoiceAllows } from '../../../src/lib/billing/invoice-status';
import { formatMoney, parseMoney } from '../../../src/lib/billing/money';
import { formatQuantity } from '../../../src/lib/billing/units';

describe('billing words', () => {
  it('prints document numbers with their series', () => {
    expect(formatDocumentNumber('invoice', 12)).toBe('INV-00012');
    expect(formatDocumentNumber('credit_note', 3)).toBe('CRN-00003');
  });

  it('lets only a draft change, and only a sent invoice be paid or credited', () => {
    expect(invoiceAllows('draft', 'edit')).toBe(true);
    expect(invoiceAllows('sent', 'edit')).toBe(false);
    expect(invoiceAllows('sent', 'credit')).toBe(true);
    expect(invoiceAllows('paid', 'credit')).toBe(false);
    expect(invoiceAllows('void', 'pay')).toBe(false);
  });

  it('shows and reads money in minor units by the currency (ISO 4217 minor units: GBP 2, JPY 0)', () => {
    expect(formatMoney(16536, 'GBP')).toBe('£165.36');
    expect(formatMoney(1500, 'JPY')).toBe('JP¥1,500');
    expect(parseMoney('12.5', 'GBP')).toBe(1250);
    expect(parseMoney('£1,234.56', 'GBP')).toBe(123456);
    expect(parseMoney('12.345', 'GBP')).toBeUndefined();
  });

  it('shows UCUM quantities with readable symbols', () => {
    expect(formatQuantity(-18, 'Cel')).toBe('−18 °C');
    expect(formatQuantity(41230, '[mi_i]')).toBe('41,230 mi');
    expect(formatQuantity(1, '{each}')).toBe('1');
    expect(formatQuantity(27, 'N.m')).toBe('27 N·m');
  });
});
