// Words of the lines printed around a shop's name at the top of a receipt that are not the name: address, phone,
// tax registration, the receipt's own heading, greetings and opening hours. As data, in the style of
// summary-words.ts: upper case without accents, and where each comes from: "common practice" (seen on receipts of
// that country) or "memory" (the writer's knowledge of the language, not checked against a published list).

export interface HeadingWords {
  kind: 'address' | 'phone' | 'tax id' | 'document' | 'greeting' | 'opening hours' | 'staff';
  languages: string[];
  source: 'common practice' | 'memory';
  words: string[];
}

export const HEADING_WORDS: HeadingWords[] = [
  { kind: 'address', languages: ['en', 'ms'], source: 'common practice', words: ['JALAN', 'JLN', 'LORONG', 'TAMAN', 'LOT', 'ROAD', 'STREET', 'AVENUE', 'LANE', 'DRIVE', 'SUITE', 'FLOOR', 'FLR', 'BLOCK', 'UNIT', 'BANDAR', 'KAWASAN', 'PERINDUSTRIAN'] },
  { kind: 'address', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt'], source: 'memory', words: ['STRASSE', 'STR', 'PLATZ', 'RUE', 'AVENIDA', 'CALLE', 'PLAZA', 'VIA', 'VIALE', 'PIAZZA', 'STRAAT', 'PLEIN', 'RUA', 'TRAVESSA'] },
  { kind: 'phone', languages: ['en', 'ms'], source: 'common practice', words: ['TEL', 'TELEPHONE', 'PHONE', 'FAX', 'HP'] },
  { kind: 'phone', languages: ['de', 'es', 'it', 'nl', 'pt'], source: 'memory', words: ['TELEFON', 'TELEFONO', 'TELEFOON'] },
  { kind: 'tax id', languages: ['en', 'ms'], source: 'common practice', words: ['GST', 'SST', 'VAT', 'REG', 'ABN', 'TIN', 'ROC'] },
  { kind: 'tax id', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt', 'id'], source: 'memory', words: ['SIRET', 'SIREN', 'NIF', 'CIF', 'IVA', 'BTW', 'KVK', 'UID', 'USTID', 'STEUERNUMMER', 'NPWP'] },
  { kind: 'document', languages: ['en', 'ms'], source: 'common practice', words: ['RECEIPT', 'INVOICE', 'TAX', 'SIMPLIFIED', 'CASH', 'BILL', 'RESIT', 'COPY', 'DUPLICATE', 'ORDER', 'TABLE', 'DATE', 'TIME', 'CASHIER', 'CHECK'] },
  { kind: 'document', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt'], source: 'memory', words: ['QUITTUNG', 'BELEG', 'RECHNUNG', 'KASSENBON', 'TICKET', 'FACTURE', 'FACTURA', 'RECIBO', 'SCONTRINO', 'FATTURA', 'BON', 'KASSABON', 'FACTUUR', 'FATURA'] },
  { kind: 'greeting', languages: ['en', 'ms'], source: 'common practice', words: ['WELCOME', 'THANK', 'THANKS', 'SELAMAT'] },
  { kind: 'greeting', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt'], source: 'memory', words: ['WILLKOMMEN', 'BIENVENUE', 'BIENVENIDO', 'BENVENUTO', 'WELKOM', 'BEM'] },
  // "SHOPPING HOURS", "OPEN DAILY", "MON-SAT 9AM-6PM": the times a shop opens are printed under its name.
  { kind: 'opening hours', languages: ['en', 'ms'], source: 'common practice', words: ['HOURS', 'HRS', 'OPEN', 'OPENING', 'DAILY', 'WAKTU', 'OPERASI', 'BUKA'] },
  { kind: 'opening hours', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt'], source: 'memory', words: ['OFFNUNGSZEITEN', 'GEOFFNET', 'HORAIRES', 'OUVERT', 'HORARIO', 'ABIERTO', 'ORARIO', 'APERTO', 'OPENINGSTIJDEN', 'GEOPEND', 'ABERTO'] },
  { kind: 'staff', languages: ['en'], source: 'common practice', words: ['SERVER', 'OPERATOR', 'SALESPERSON', 'WAITER'] },
];

/** Every word that marks a line as something other than the shop's name. */
export const NOT_A_NAME_WORDS: string[] = [...new Set(HEADING_WORDS.flatMap((entry) => entry.words))];

/** The kinds of line that hold the shop's address and contact: the name is printed above them. */
export const ADDRESS_WORDS: string[] = [...new Set(HEADING_WORDS.filter((entry) => entry.kind === 'address' || entry.kind === 'phone').flatMap((entry) => entry.words))];
