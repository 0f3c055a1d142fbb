// Which systems carry the safety caution (DESIGN §9), and its wording, shared by screens and exports.

const SAFETY_CRITICAL = /\b(fuel|brakes?|braking|steering|wiring|harness|electrical|lift(ing)?|jack(ing)?)\b/i;

export function needsSafetyCaution(systemName: string): boolean {
  return SAFETY_CRITICAL.test(systemName);
}

export const SAFETY_CAUTION =
  'Tallyhood records costs only. Fuel, brake, steering, wiring and lifting work can injure people: follow the ' +
  "manufacturer's instructions, local codes, track inspection rules and licensed practice.";
