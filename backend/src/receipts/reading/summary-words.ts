// The words receipts print beside their summary figures, in many languages, as data. Each entry is written
// upper case without accents (matching folds accents and OCR slips away) and says where it comes from:
// "common practice" (seen on receipts of that trade and country) or "memory" (the writer's knowledge of the
// language's trade and tax vocabulary, not checked against a published list).

export type SummaryRole =
  /** The amount to pay. */
  | 'total'
  /** A total that names itself final after cash rounding or over other totals ("ROUNDED TOTAL", "GRAND TOTAL"). */
  | 'final_total'
  | 'subtotal'
  | 'tax'
  | 'shipping'
  /** A service charge or tip added to the bill (restaurants, hotels). */
  | 'service'
  | 'discount'
  /** What the customer handed over: cash, card, voucher. */
  | 'tendered'
  | 'change'
  /** A cash-rounding adjustment (5-cent rounding and the like). */
  | 'rounding';

export interface SummaryWords {
  role: SummaryRole;
  /** Language tags the phrases belong to; "*" for words shared by many. */
  languages: string[];
  source: 'common practice' | 'memory';
  phrases: string[];
}

export const SUMMARY_WORDS: SummaryWords[] = [
  // Totals
  { role: 'total', languages: ['en', 'ms'], source: 'common practice', phrases: ['TOTAL', 'TOT', 'TTL', 'TOTAL AMOUNT', 'AMOUNT DUE', 'BALANCE DUE', 'TOTAL DUE', 'TOTAL PAYABLE', 'AMOUNT PAYABLE', 'TOTAL SALES', 'NET AMOUNT', 'TOTAL INCL', 'TOTAL INCLUSIVE', 'TOTAL RM', 'NETT AMOUNT', 'TOTAL AMT', 'NET AMT', 'NETT AMT', 'TOTAL SALES INCLUSIVE', 'AMOUNT TO BE PAID', 'AMOUNT TO PAY', 'TOTAL INCLUSIVE OF GST'] },
  { role: 'final_total', languages: ['en', 'ms'], source: 'common practice', phrases: ['GRAND TOTAL', 'NETT TOTAL', 'NET TOTAL', 'ROUNDED TOTAL', 'TOTAL ROUNDED', 'ROUND TOTAL', 'TOTAL AFTER ROUNDING', 'ROUNDED AMOUNT', 'TOTAL TO PAY', 'PAYABLE'] },
  { role: 'total', languages: ['de'], source: 'memory', phrases: ['SUMME', 'GESAMT', 'GESAMTBETRAG', 'GESAMTSUMME', 'BETRAG', 'RECHNUNGSBETRAG', 'BRUTTO', 'BRUTTOBETRAG'] },
  { role: 'final_total', languages: ['de'], source: 'memory', phrases: ['ZU ZAHLEN', 'ENDSUMME', 'ENDBETRAG', 'ZAHLBETRAG'] },
  { role: 'total', languages: ['fr'], source: 'memory', phrases: ['TOTAL TTC', 'MONTANT TTC', 'MONTANT', 'MONTANT DU', 'TOTAL EUR'] },
  { role: 'final_total', languages: ['fr'], source: 'memory', phrases: ['NET A PAYER', 'A PAYER', 'TOTAL A PAYER'] },
  { role: 'total', languages: ['es', 'pt'], source: 'memory', phrases: ['IMPORTE', 'IMPORTE TOTAL', 'TOTAL EUROS', 'VALOR TOTAL', 'TOTAL GERAL'] },
  { role: 'final_total', languages: ['es', 'pt'], source: 'memory', phrases: ['TOTAL A PAGAR', 'A PAGAR', 'VALOR A PAGAR'] },
  { role: 'total', languages: ['it'], source: 'memory', phrases: ['TOTALE', 'TOTALE EURO', 'IMPORTO', 'TOTALE COMPLESSIVO', 'IMPORTO TOTALE'] },
  { role: 'final_total', languages: ['it'], source: 'memory', phrases: ['DA PAGARE', 'TOTALE DA PAGARE'] },
  { role: 'total', languages: ['nl'], source: 'memory', phrases: ['TOTAAL', 'BEDRAG', 'TOTAALBEDRAG'] },
  { role: 'final_total', languages: ['nl'], source: 'memory', phrases: ['TE BETALEN', 'TOTAAL TE BETALEN'] },
  { role: 'total', languages: ['ms'], source: 'memory', phrases: ['JUMLAH', 'JUMLAH BERSIH'] },
  { role: 'final_total', languages: ['ms'], source: 'memory', phrases: ['JUMLAH BESAR', 'JUMLAH KESELURUHAN', 'JUMLAH PERLU DIBAYAR'] },

  // Subtotals (before tax, or the total of the item lines)
  { role: 'subtotal', languages: ['en'], source: 'common practice', phrases: ['SUBTOTAL', 'SUB TOTAL', 'MERCHANDISE', 'TOTAL EXCL', 'TOTAL EXCLUDING', 'TOTAL EXCLUSIVE', 'TOTAL BEFORE TAX', 'AMOUNT EXCL', 'TOTAL SALES EXCLUDING', 'NET TOTAL EXCL'] },
  { role: 'subtotal', languages: ['de'], source: 'memory', phrases: ['ZWISCHENSUMME', 'NETTO', 'NETTOBETRAG', 'SUMME NETTO', 'ZWSUMME'] },
  { role: 'subtotal', languages: ['fr'], source: 'memory', phrases: ['SOUS TOTAL', 'SOUSTOTAL', 'TOTAL HT', 'MONTANT HT'] },
  { role: 'subtotal', languages: ['es', 'pt'], source: 'memory', phrases: ['SUBTOTAL', 'BASE IMPONIBLE', 'TOTAL SEM IVA'] },
  { role: 'subtotal', languages: ['it'], source: 'memory', phrases: ['SUBTOTALE', 'IMPONIBILE', 'PARZIALE'] },
  { role: 'subtotal', languages: ['nl'], source: 'memory', phrases: ['SUBTOTAAL', 'TUSSENTOTAAL', 'TOTAAL EXCL'] },
  { role: 'subtotal', languages: ['ms'], source: 'memory', phrases: ['JUMLAH KECIL', 'JUMLAH SEBELUM CUKAI'] },

  // Taxes
  { role: 'tax', languages: ['en'], source: 'common practice', phrases: ['TAX', 'SALES TAX', 'VAT', 'GST', 'HST', 'PST', 'QST', 'SST', 'SERVICE TAX', 'TOTAL TAX', 'TOTAL GST', 'TOTAL VAT', 'GST AMOUNT', 'VAT AMOUNT'] },
  { role: 'tax', languages: ['de'], source: 'memory', phrases: ['MWST', 'MWST.', 'MEHRWERTSTEUER', 'UST', 'UMSATZSTEUER', 'STEUER', 'ENTHALTENE MWST'] },
  { role: 'tax', languages: ['fr'], source: 'memory', phrases: ['TVA', 'TAXE', 'TAXES', 'MONTANT TVA', 'TOTAL TVA'] },
  { role: 'tax', languages: ['es', 'it', 'pt'], source: 'memory', phrases: ['IVA', 'IGIC', 'CUOTA IVA', 'IMPOSTA', 'IMPOSTE', 'TOTALE IVA', 'IMPOSTO'] },
  { role: 'tax', languages: ['nl'], source: 'memory', phrases: ['BTW', 'TOTAAL BTW', 'BTW BEDRAG'] },
  { role: 'tax', languages: ['ms'], source: 'memory', phrases: ['CUKAI', 'CUKAI JUALAN', 'CUKAI PERKHIDMATAN'] },

  // Shipping and delivery
  { role: 'shipping', languages: ['en'], source: 'common practice', phrases: ['SHIPPING', 'FREIGHT', 'DELIVERY', 'POSTAGE', 'CARRIAGE', 'S&H', 'SHIPPING AND HANDLING'] },
  { role: 'shipping', languages: ['de'], source: 'memory', phrases: ['VERSAND', 'VERSANDKOSTEN', 'LIEFERUNG', 'FRACHT', 'PORTO'] },
  { role: 'shipping', languages: ['fr'], source: 'memory', phrases: ['LIVRAISON', 'FRAIS DE PORT', 'FRAIS DE LIVRAISON', 'EXPEDITION'] },
  { role: 'shipping', languages: ['es', 'pt'], source: 'memory', phrases: ['ENVIO', 'GASTOS DE ENVIO', 'PORTES', 'FRETE', 'TRANSPORTE'] },
  { role: 'shipping', languages: ['it'], source: 'memory', phrases: ['SPEDIZIONE', 'SPESE DI SPEDIZIONE', 'TRASPORTO', 'CONSEGNA'] },
  { role: 'shipping', languages: ['nl'], source: 'memory', phrases: ['VERZENDKOSTEN', 'VERZENDING', 'BEZORGING', 'LEVERING'] },
  { role: 'shipping', languages: ['ms'], source: 'memory', phrases: ['PENGHANTARAN', 'KOS PENGHANTARAN'] },

  // Service charges
  { role: 'service', languages: ['en', 'ms'], source: 'common practice', phrases: ['SERVICE CHARGE', 'SERVICE', 'SVC CHARGE', 'SRV CHG', 'SVC CHG', 'SERV CHARGE', 'SVR TAX', 'TIP', 'GRATUITY', 'CAJ PERKHIDMATAN'] },
  { role: 'service', languages: ['de', 'fr', 'es', 'it', 'nl', 'pt'], source: 'memory', phrases: ['BEDIENUNG', 'TRINKGELD', 'POURBOIRE', 'SERVICIO', 'PROPINA', 'COPERTO', 'SERVIZIO', 'FOOI', 'BEDIENINGSGELD', 'GORJETA', 'TAXA DE SERVICO'] },

  // Discounts
  { role: 'discount', languages: ['en'], source: 'common practice', phrases: ['DISCOUNT', 'COUPON', 'SAVINGS', 'PROMO', 'MARKDOWN', 'TOTAL DISCOUNT'] },
  { role: 'discount', languages: ['de'], source: 'memory', phrases: ['RABATT', 'NACHLASS', 'PREISNACHLASS', 'ERMASSIGUNG', 'GUTSCHEIN'] },
  { role: 'discount', languages: ['fr'], source: 'memory', phrases: ['REMISE', 'REDUCTION', 'RABAIS', 'RISTOURNE'] },
  { role: 'discount', languages: ['es', 'pt'], source: 'memory', phrases: ['DESCUENTO', 'DESCONTO', 'DTO', 'PROMOCION', 'PROMOCAO'] },
  { role: 'discount', languages: ['it'], source: 'memory', phrases: ['SCONTO', 'SCONTI', 'RIBASSO'] },
  { role: 'discount', languages: ['nl'], source: 'memory', phrases: ['KORTING', 'ACTIEKORTING'] },
  { role: 'discount', languages: ['ms'], source: 'memory', phrases: ['DISKAUN', 'POTONGAN', 'POTONGAN HARGA'] },

  // Amounts tendered
  { role: 'tendered', languages: ['en'], source: 'common practice', phrases: ['CASH', 'TENDERED', 'TENDER', 'CASH TENDERED', 'AMOUNT TENDERED', 'PAID', 'PAYMENT', 'CARD', 'CREDIT CARD', 'DEBIT', 'DEBIT CARD', 'VISA', 'MASTERCARD', 'AMEX', 'EFTPOS', 'VOUCHER', 'CASH RECEIVED'] },
  { role: 'tendered', languages: ['de'], source: 'memory', phrases: ['GEGEBEN', 'BAR', 'BARGELD', 'EC', 'EC KARTE', 'KARTE', 'KARTENZAHLUNG', 'GIROCARD', 'ERHALTEN'] },
  { role: 'tendered', languages: ['fr'], source: 'memory', phrases: ['ESPECES', 'CB', 'CARTE', 'CARTE BANCAIRE', 'REGLEMENT', 'PAYE', 'RECU', 'CHEQUE'] },
  { role: 'tendered', languages: ['es'], source: 'memory', phrases: ['EFECTIVO', 'ENTREGADO', 'ENTREGA', 'TARJETA', 'PAGADO', 'RECIBIDO'] },
  { role: 'tendered', languages: ['it'], source: 'memory', phrases: ['CONTANTI', 'CONTANTE', 'CARTA', 'BANCOMAT', 'PAGATO', 'CARTA DI CREDITO', 'PAGAMENTO'] },
  { role: 'tendered', languages: ['nl'], source: 'memory', phrases: ['CONTANT', 'PIN', 'PINNEN', 'BETAALD', 'BETALING', 'MAESTRO'] },
  { role: 'tendered', languages: ['pt'], source: 'memory', phrases: ['DINHEIRO', 'NUMERARIO', 'CARTAO', 'MULTIBANCO', 'PAGO', 'RECEBIDO', 'ENTREGUE'] },
  { role: 'tendered', languages: ['ms'], source: 'memory', phrases: ['TUNAI', 'BAYARAN', 'KAD', 'KAD KREDIT', 'DIBAYAR'] },

  // Change given back
  { role: 'change', languages: ['en'], source: 'common practice', phrases: ['CHANGE', 'CHANGE DUE', 'CASH CHANGE'] },
  { role: 'change', languages: ['de'], source: 'memory', phrases: ['RUCKGELD', 'WECHSELGELD', 'ZURUCK', 'RUCKGABE'] },
  { role: 'change', languages: ['fr'], source: 'memory', phrases: ['RENDU', 'MONNAIE', 'RENDU MONNAIE', 'A RENDRE'] },
  { role: 'change', languages: ['es', 'it'], source: 'memory', phrases: ['CAMBIO', 'VUELTO', 'DEVOLUCION', 'RESTO', 'SU CAMBIO'] },
  { role: 'change', languages: ['nl'], source: 'memory', phrases: ['WISSELGELD', 'TERUG'] },
  { role: 'change', languages: ['pt'], source: 'memory', phrases: ['TROCO'] },
  { role: 'change', languages: ['ms'], source: 'memory', phrases: ['BAKI', 'WANG BAKI'] },

  // Cash rounding
  { role: 'rounding', languages: ['en'], source: 'common practice', phrases: ['ROUNDING', 'ROUNDING ADJ', 'ROUNDING ADJUSTMENT', 'ROUND ADJ', 'ROUNDING ADJT', 'RND ADJ', 'ADJUSTMENT', 'ROUNDING AMT'] },
  { role: 'rounding', languages: ['de'], source: 'memory', phrases: ['RUNDUNG', 'RUNDUNGSDIFFERENZ'] },
  { role: 'rounding', languages: ['fr'], source: 'memory', phrases: ['ARRONDI', 'ARRONDISSEMENT'] },
  { role: 'rounding', languages: ['es'], source: 'memory', phrases: ['REDONDEO'] },
  { role: 'rounding', languages: ['it'], source: 'memory', phrases: ['ARROTONDAMENTO', 'ABBUONO'] },
  { role: 'rounding', languages: ['nl'], source: 'memory', phrases: ['AFRONDING', 'AFRONDEN', 'AFRONDINGSVERSCHIL'] },
  { role: 'rounding', languages: ['pt'], source: 'memory', phrases: ['ARREDONDAMENTO'] },
  { role: 'rounding', languages: ['ms'], source: 'memory', phrases: ['PELARASAN', 'PEMBUNDARAN', 'PELARASAN PEMBUNDARAN'] },
];

/**
 * Words that make a line beside a total word something else: a count of items, points earned, money saved
 * (common practice in English; the others from memory).
 */
export const NOT_A_SUM_WORDS: string[] = [
  'QTY', 'QUANTITY', 'ITEMS', 'ITEM', 'PCS', 'UNITS', 'POINTS', 'POINT', 'SAVED', 'SAVING', 'SAVINGS', 'WEIGHT', 'COUNT', 'NO', 'TIPS',
  'ANZAHL', 'ARTIKEL', 'POSITIONEN', 'PUNKTE', 'STUCK',
  'ARTICLES', 'ARTICLE', 'POINTS', 'ECONOMIE', 'NOMBRE',
  'ARTICULOS', 'UNIDADES', 'PUNTOS', 'AHORRO',
  'ARTICOLI', 'PEZZI', 'PUNTI', 'RISPARMIO',
  'ARTIKELEN', 'STUKS', 'PUNTEN',
  'ARTIGOS', 'UNIDADES', 'PONTOS',
  'KUANTITI', 'BILANGAN', 'MATA',
];

/** Words that turn "total" plus a tax word into the amount before tax (common practice / memory). */
export const EXCLUDING_WORDS: string[] = ['EXCL', 'EXCLUDING', 'EXCLUSIVE', 'EXCLUDED', 'BEFORE', 'W/O', 'WITHOUT', 'HT', 'NETTO', 'EXKL', 'OHNE', 'SANS', 'SIN', 'SENZA', 'SEM', 'ZONDER', 'TANPA', 'SEBELUM'];
/** Words that keep "total" plus a tax word a total (common practice / memory). */
export const INCLUDING_WORDS: string[] = ['INCL', 'INCLUDING', 'INCLUSIVE', 'INCLUDED', 'INC', 'TTC', 'INKL', 'BRUTTO', 'INCLUSO', 'INCLUIDO', 'INCLUIDA', 'INCLUSIEF', 'TERMASUK', 'WITH'];
/** Words that head a tax table printed under the total (common practice / memory). */
export const TAX_TABLE_WORDS: string[] = ['SUMMARY', 'CODE', 'RATE', 'NET', 'NETTO', 'BRUTTO', 'GROSS', 'BASE', 'ZUSAMMENFASSUNG', 'SATZ', 'TAUX', 'TASSO', 'TARIEF', 'TAXA', 'KADAR', 'RINGKASAN'];
