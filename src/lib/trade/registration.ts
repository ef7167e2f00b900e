// Number plates as people type them ("qk19 fen", "QK19-FEN") and as we store them ("QK19FEN").

/** Upper case, without spaces or dashes; throws when nothing plate-like is left. */
export function normaliseRegistration(text: string): string {
  const plate = text.replace(/[\s\-–—.]+/g, '').toUpperCase();
  if (!/^[A-Z0-9]{1,10}$/.test(plate)) {
    throw new Error(`"${text}" is not a registration: use 1 to 10 letters and digits (spaces are ignored)`);
  }
  return plate;
}
