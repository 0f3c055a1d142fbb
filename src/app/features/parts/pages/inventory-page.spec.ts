// Inventory: a part on the shelf shows its warranty in words with a link to its receipt.
import { screen } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { testPart, testSystem, testSystemsResponse } from '../../../../testing/build-fixtures';
import { renderInBuild } from '../../../../testing/render-in-build';
import { InventoryPage } from './inventory-page';

describe('InventoryPage', () => {
  it('shows the warranty of a part on the shelf, with a link to the receipt it rests on', async () => {
    const { http } = await renderInBuild(InventoryPage, { role: 'crew' });
    http.expectOne('/api/builds/b-1/systems?archived=true').flush(testSystemsResponse([testSystem('s-brakes', 'Brakes')]));
    http.expectOne('/api/builds/b-1/parts').flush({
      parts: [
        testPart('p-caliper', { description: 'Brake caliper', status: 'on_hand', storageLocation: 'Shelf B', warranty: 'lifetime', warrantyStart: '2026-03-14', warrantyReceiptId: 'r-5' }),
        testPart('p-hose', { description: 'Brake hose', status: 'on_hand', storageLocation: 'Shelf B', warranty: 6, warrantyStart: '2000-01-31', warrantyEnds: '2000-07-31' }),
      ],
    });
    await screen.findByText('Brake caliper');
    expect(screen.getByText('Lifetime warranty')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open the receipt for Brake caliper' }).getAttribute('href')).toBe('/builds/b-1/receipts/r-5');
    expect(screen.getByText('Warranty ended Jul 31, 2000')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Open the receipt for Brake hose' })).toBeNull();

    // Crew change it from here.
    await userEvent.setup().click(screen.getByRole('button', { name: 'Warranty of Brake hose' }));
    expect(await screen.findByRole('heading', { name: 'Warranty of "Brake hose"' })).toBeTruthy();
  });
});
