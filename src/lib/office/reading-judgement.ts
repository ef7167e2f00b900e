// How a recorded reading looks to the office: within the checklist's expected range or not.
// The trade rules (lib/trade) judge it further where the item names one.
import type { Severity } from '../sync/operations';

export type ReadingItem = { unit: string | null; expectedMin: number | null; expectedMax: number | null; rule: string | null };
export type RecordedReading = { value: number | null; textValue: string | null; unit: string | null };
export type VehicleFacts = { oilGrade: string | null };
export type Judgement = { severity: Severity; message: string };

export function judgeRecordedReading(item: ReadingItem, reading: RecordedReading, vehicle: VehicleFacts): Judgement | null {
  if (reading.value === null) {
    if (item.rule === 'oil_grade' && vehicle.oilGrade && reading.textValue) {
      return reading.textValue.toUpperCase() === vehicle.oilGrade.toUpperCase()
        ? { severity: 'ok', message: `Matches the vehicle’s spec (${vehicle.oilGrade}).` }
        : { severity: 'watch', message: `The vehicle’s spec says ${vehicle.oilGrade}.` };
    }
    return null;
  }
  const unit = reading.unit ?? item.unit ?? '';
  const range = `${item.expectedMin ?? '…'}–${item.expectedMax ?? '…'} ${unit}`.trim();
  if (item.expectedMin !== null && reading.value < item.expectedMin) {
    return { severity: 'soon', message: `Below the expected range (${range}).` };
  }
  if (item.expectedMax !== null && reading.value > item.expectedMax) {
    return { severity: 'soon', message: `Above the expected range (${range}).` };
  }
  if (item.expectedMin === null && item.expectedMax === null) return null;
  return { severity: 'ok', message: `Within the expected range (${range}).` };
}
