// Vehicle identification numbers: ISO 3779 structure and the North-American check digit of
// 49 CFR 565.15.
import { describe } from './guard';

export const VIN_SOURCE = 'ISO 3779 (structure: WMI, VDS, VIS); 49 CFR 565.15 Tables III–V (check digit)';

// 49 CFR 565.15, Table III: the value each letter stands for. I, O and Q are never used (ISO 3779),
// because they read as 1 and 0.
const TRANSLITERATION: Record<string, number> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};
// 49 CFR 565.15, Table IV: the weight of each position, 1 to 17 (position 9, the check digit, weighs 0).
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2] as const;
const CHECK_POSITION = 8; // zero-based: the ninth character

// WMIs beginning 1–5 are assigned to North America (ISO 3780), where the check digit is required.
const NORTH_AMERICA = /^[1-5]/;

export type VinCheck = {
  /** Upper-cased, spaces and dashes removed: what was checked. */
  vin: string;
  /** The structure is right (17 characters, none of I, O, Q) and, where required, the check digit agrees. */
  valid: boolean;
  wmi: string | null;
  vds: string | null;
  vis: string | null;
  checkDigit: {
    expected: string;
    found: string;
    matches: boolean;
    /** Required for North-American WMIs; elsewhere a mismatch is reported, not held against the VIN. */
    required: boolean;
  } | null;
  problems: string[];
  notes: string[];
  source: string;
};

/** The 49 CFR 565.15 check digit of a 17-character VIN ('0'–'9' or 'X'). */
export function vinCheckDigit(vin: string): string {
  let sum = 0;
  for (let i = 0; i < 17; i++) {
    const c = vin[i]!;
    const value = /\d/.test(c) ? Number(c) : TRANSLITERATION[c];
    if (value === undefined) throw new Error(`"${c}" cannot appear in a VIN`);
    sum += value * WEIGHTS[i]!;
  }
  const remainder = sum % 11;
  return remainder === 10 ? 'X' : String(remainder);
}

/**
 * Checks a VIN as typed. Lower case, spaces and dashes are accepted and normalised (a VIN is
 * read off a plate or a document, often by phone); wrong length or letters that a VIN never uses
 * make it invalid.
 */
export function checkVin(text: string): VinCheck {
  if (typeof text !== 'string') throw new Error(`A VIN must be text, not ${describe(text)}`);
  const vin = text.replace(/[\s-]+/g, '').toUpperCase();
  const problems: string[] = [];
  const notes: string[] = [];
  if (vin.length !== 17) problems.push(`A VIN has 17 characters; this has ${vin.length}.`);
  const illegal = [...new Set(vin.replace(/[A-HJ-NPR-Z0-9]/g, ''))];
  if (illegal.length > 0) {
    const ioq = illegal.filter((c) => 'IOQ'.includes(c));
    problems.push(
      ioq.length > 0
        ? `A VIN never uses ${ioq.join(', ')} (they read as 1 and 0): check ${ioq.length > 1 ? 'those characters' : 'that character'}.`
        : `A VIN holds only letters and digits; found ${illegal.map((c) => `"${c}"`).join(', ')}.`,
    );
  }
  if (problems.length > 0) {
    return { vin, valid: false, wmi: null, vds: null, vis: null, checkDigit: null, problems, notes, source: VIN_SOURCE };
  }
  const expected = vinCheckDigit(vin);
  const found = vin[CHECK_POSITION]!;
  const required = NORTH_AMERICA.test(vin);
  const matches = expected === found;
  if (!matches) {
    if (required) problems.push(`The check digit (9th character) is ${found} but should be ${expected}: a character is probably misread.`);
    else notes.push(`The 9th character is not a North-American check digit (${expected} would be); VINs from elsewhere need not carry one.`);
  }
  return {
    vin,
    valid: problems.length === 0,
    wmi: vin.slice(0, 3),
    vds: vin.slice(3, 9),
    vis: vin.slice(9),
    checkDigit: { expected, found, matches, required },
    problems,
    notes,
    source: VIN_SOURCE,
  };
}
