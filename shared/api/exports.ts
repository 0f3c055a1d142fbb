// Response type of the printable build sheet: the fitted parts by system, a summary per system and the caution.

export interface BuildSheetPartDto {
  systemId: string;
  system: string;
  description: string;
  partNumber: string;
  quantity: string;
  unit: string;
  /** What the part cost on filed receipts, with its share of tax and shipping less discounts; null when no receipt names it. */
  cost: string | null;
  /** The latest purchase date of those receipts (YYYY-MM-DD), or null. */
  boughtOn: string | null;
}

export interface BuildSheetSystemDto {
  systemId: string;
  name: string;
  /** How many fitted parts of the system the sheet lists. */
  fittedParts: number;
  /** What the fitted parts listed cost. */
  fittedCost: string;
  /** The ledger's net cost of the whole system (fitted or not, fees included). */
  netCost: string;
  safetyCaution: boolean;
}

export interface BuildSheetDto {
  buildName: string;
  vehicle: string;
  currency: string;
  locale: string;
  parts: BuildSheetPartDto[];
  /** Systems with fitted parts or money spent, in the build's order. */
  systems: BuildSheetSystemDto[];
  total: { fittedParts: number; fittedCost: string; netCost: string };
  safetyCaution: string;
  taxNote: string;
}
