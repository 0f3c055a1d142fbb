// Response types of the ledger: budget against money spent, per system and for the whole build.

export interface LedgerFigures {
  budget: string;
  /** Sum of the parts' estimates. */
  estimate: string;
  /** Net cash out on filed receipts: purchases, deposits and fees with their tax and shipping, less money back. */
  spent: string;
  /** What the system has cost: purchases with their tax, shipping and fees, less discounts and refunded returns, plus forfeited cores. */
  netCost: string;
  /** Core deposits paid and not yet refunded or forfeited. */
  coreDepositsOutstanding: string;
  /** Parts sent back whose refund has not been filed yet (what was paid for them). */
  returnsAwaitingRefund: string;
  /** Estimates of the parts not bought yet. */
  remainingEstimate: string;
  /** Budget less the plain forecast: positive is under budget. */
  variance: string;
  /** Net cost plus the remaining estimate. */
  forecast: string;
  /** Net cost plus the remaining estimate times the build's own overrun factor. */
  forecastAdjusted: string;
}

export interface LedgerSystemDto extends LedgerFigures {
  systemId: string;
  name: string;
  safetyCaution: boolean;
}

export interface LedgerDto {
  currency: string;
  systems: LedgerSystemDto[];
  /** The same figures for the whole build: the systems add up to it to the cent. */
  total: LedgerFigures;
  contingencyBudget: string;
  /** Actual over estimate for parts already bought, as a decimal string; "1" until enough parts are bought. */
  overrunFactor: string;
  /** How many bought parts with an estimate the factor is based on. */
  overrunSample: number;
}
