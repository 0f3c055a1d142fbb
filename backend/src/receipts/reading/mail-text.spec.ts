// A mailed message's body as the reader sees it: the forwarded original found under the common forward markers, quoting
// removed, HTML tables kept in columns, and the parser reading an order table whose last column is headed "Total".
import { convert } from 'html-to-text';
import { originalText, textPage } from './mail-text';
import { parseReceipt } from './parse-receipt';

describe('originalText', () => {
  it('reads the whole body when nothing is forwarded', () => {
    expect(originalText('Order 12\r\nTotal 5.00\r\n')).toEqual({ text: 'Order 12\nTotal 5.00', originalFrom: null });
  });

  it.each([
    { marker: '---------- Forwarded message ---------' },
    { marker: '-----Original Message-----' },
    { marker: '-------- Forwarded Message --------' },
    { marker: 'Begin forwarded message:' },
  ])('takes the original under "$marker", without its headers or quoting', ({ marker }) => {
    const body = ['See below', '', marker, '', 'From: Gearloft Supply <orders@gearloft.example>', 'Sent: Friday', 'Subject: Order', '', '> Wiper blade  1  9.00  9.00', '> Total 9.00'].join('\n');
    expect(originalText(body)).toEqual({ text: 'Wiper blade  1  9.00  9.00\nTotal 9.00', originalFrom: 'Gearloft Supply <orders@gearloft.example>' });
  });

  it('takes the last original of a forward of a forward', () => {
    const body = ['Begin forwarded message:', 'From: Ana', 'Subject: Fwd', '', 'Begin forwarded message:', 'From: Shop', 'Subject: Order', '', 'Total 3.00'].join('\n');
    expect(originalText(body)).toEqual({ text: 'Total 3.00', originalFrom: 'Shop' });
  });

  it('finds a header block without a marker (a message attached to the forward)', () => {
    expect(originalText('fyi\n\nFrom: shop@x.example\nSubject: Order 4\nDate: Mon\n\nTotal 4.00')).toEqual({ text: 'Total 4.00', originalFrom: 'shop@x.example' });
  });
});

describe('textPage', () => {
  it('places each word by its character column, one line per text line, blank lines skipped', () => {
    const page = textPage('Brake hose  2\n\nTotal  9.00');
    expect(page.lines.map((line) => line.words.map((word) => [word.text, word.box.x, word.box.y]))).toEqual([
      [['Brake', 0, 0], ['hose', 60, 0], ['2', 120, 0]],
      [['Total', 0, 48], ['9.00', 70, 48]],
    ]);
    expect([page.width, page.height, page.source]).toEqual([130, 72, 'text']);
  });

  it('lets the parser read an HTML order table whose last column is headed "Total"', () => {
    const html = `<table><tr><th>Item</th><th>Qty</th><th>Price</th><th>Total</th></tr>
      <tr><td>Coolant hose</td><td>2</td><td>$14.25</td><td>$28.50</td></tr></table>
      <table><tr><td>Subtotal</td><td>$28.50</td></tr><tr><td>Order total</td><td>$28.50</td></tr></table>`;
    const text = convert(html, { wordwrap: false, selectors: [{ selector: 'table', format: 'dataTable', options: { uppercaseHeaderCells: false } }] });
    const reading = parseReceipt([textPage(text)], { locale: 'en-US', minorUnits: 2 });
    expect(reading.lines.map((line) => [line.description, line.quantity, line.unitPrice, line.amount])).toEqual([['Coolant hose', '2', '14.25', '28.50']]);
    expect([reading.subtotal.value, reading.total.value]).toEqual(['28.50', '28.50']);
  });
});
