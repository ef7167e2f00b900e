// How a UCUM code reads on screen: the trade module's label, or nothing for annotations such as
// {each} and {grade}, which are counts and text rather than units.
import { isKnownUnit, unit } from '../../lib/trade';

export function unitLabel(code: string | null | undefined): string {
  if (!code || code.startsWith('{')) return '';
  return isKnownUnit(code) ? unit(code).label : code;
}
