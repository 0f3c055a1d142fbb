// The shop's name among the lines at the top of a slip (invented shops): a name broken over two lines, headings that
// are no names (opening hours, the document's title, address and phone), handwriting and the OCR's guesses at a logo.
import { parseReceipt } from './parse-receipt';
import { slipPage } from './slip-page';
import type { TextPage } from './text-lines';

const vendorOf = (page: TextPage, locale = 'en-MY') => parseReceipt([page], { locale, minorUnits: 2, readOn: '2026-06-30' }).vendor.value;
const slip = (rows: string[]) => slipPage([...rows, 'PAIP  5.00', 'TOTAL  5.00']);

describe('the shop name', () => {
  it('joins a name broken over two lines after "&", "AND" or "UND", whichever half the print makes taller', () => {
    const page = slip(['LANTERN HARDWARE &', 'ELECTRICAL', 'NO 5 JALAN MAWAR']);
    // The second half printed taller than the first.
    for (const word of page.lines[1].words) word.box.h = 30;
    expect(vendorOf(page)).toBe('LANTERN HARDWARE & ELECTRICAL');
    expect(vendorOf(slip(['MÜHLE UND', 'SÖHNE', 'Hafenstr. 12']), 'de-DE')).toBe('MÜHLE UND SÖHNE');
  });

  it('joins the legal form printed under the name, even where a word of the name is one letter off an address word', () => {
    // BORONG (wholesale) is one letter from LORONG (lane): short words must match an address word exactly.
    expect(vendorOf(slip(['PASAR BORONG CERIA', 'SDN BHD', '(124625-H)', 'NO 19 JALAN TASIK']))).toBe('PASAR BORONG CERIA SDN BHD');
  });

  it('passes over opening hours and the document\'s title under the name', () => {
    const page = slip(['SHOPPING HOURS', 'KEDAI CERIA', 'TAX INVOICE', 'MON-SAT 1000 HRS - 2200 HRS']);
    for (const word of page.lines[0].words) word.box.h = 40;
    expect(vendorOf(page)).toBe('KEDAI CERIA');
  });

  it('passes over a handwritten note in small letters, and does not join it to the name below', () => {
    const page = slip(['lim ah kow', 'KEDAI CERIA TRADING', 'NO 5 JALAN MAWAR']);
    for (const word of page.lines[0].words) word.box.h = 45;
    expect(vendorOf(page)).toBe('KEDAI CERIA TRADING');
  });

  it('drops the words the OCR only guessed at (a logo read as letters) and prefers the name above the address', () => {
    const page = slipPage(['Atsplis', 'KEDAI CERIA', 'NO 5 JALAN MAWAR', 'SELANGOR DARUL EHSAN', 'PAIP  5.00', 'TOTAL  5.00'], 0.95, { 0: 0.05 });
    for (const word of page.lines[0].words) word.box.h = 60;
    expect(vendorOf(page)).toBe('KEDAI CERIA');
    // With the name lost to the OCR, a line under the address is still offered rather than nothing.
    expect(vendorOf(slipPage(['NO 5 JALAN MAWAR', 'SELANGOR DARUL EHSAN', 'PAIP  5.00', 'TOTAL  5.00']))).toBe('SELANGOR DARUL EHSAN');
  });
});
