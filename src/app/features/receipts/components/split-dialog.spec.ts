// Split dialog: starts with two shares that add up to the line to the cent, says how far off the shares are, and sends them only when they add up.
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { render, screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { SplitDialog, SplitDialogData } from './split-dialog';

const data: SplitDialogData = {
  description: 'Hose clamp assortment',
  amount: '10.01',
  currency: 'USD',
  locale: 'en-US',
  systems: [],
  systemId: 's-cooling',
};

async function open() {
  const close = jest.fn();
  await render(SplitDialog, {
    providers: [
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: { close } },
    ],
  });
  return close;
}

describe('SplitDialog', () => {
  it('starts with 5.00 and 5.01 for a 10.01 line, which add up', async () => {
    await open();
    expect((screen.getByRole('textbox', { name: 'Share 1 amount' }) as HTMLInputElement).value).toBe('5.00');
    expect((screen.getByRole('textbox', { name: 'Share 2 amount' }) as HTMLInputElement).value).toBe('5.01');
    expect(screen.getByText(/The shares add up to the line\./)).toBeTruthy();
  });

  it('says how much is not shared out, refuses to send, then sends the shares once they add up', async () => {
    const close = await open();
    const user = userEvent.setup();
    const second = screen.getByRole('textbox', { name: 'Share 2 amount' });
    await user.clear(second);
    await user.type(second, '4.50');
    expect(await screen.findByText(/\$0\.51 of the line is not shared out yet\./)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Split line' }));
    expect(close).not.toHaveBeenCalled();

    await user.clear(second);
    await user.type(second, '6.00');
    expect(await screen.findByText(/The shares are \$0\.99 more than the line\./)).toBeTruthy();

    await user.clear(second);
    await user.type(second, '5.01');
    await user.click(screen.getByRole('button', { name: 'Split line' }));
    expect(close).toHaveBeenCalledWith([
      { amount: '5.00', systemId: 's-cooling', partId: null },
      { amount: '5.01', systemId: null, partId: null },
    ]);
  });
});
