// The captures chip: hidden with nothing waiting, counts what waits and what was refused, and discards a refused
// capture only when the person asks.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController } from '@angular/common/http/testing';
import { render, screen, waitFor } from '@testing-library/angular/zoneless';
import userEvent from '@testing-library/user-event';
import { clear, createStore } from 'idb-keyval';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { Session } from '../../../core/auth/session';
import { CAPTURE_DATABASE, CaptureQueue } from '../services/capture-queue';
import { CaptureStatus } from './capture-status';

beforeEach(() => clear(createStore(CAPTURE_DATABASE.name, CAPTURE_DATABASE.store)));

it('counts a refused capture, gives its reason and discards it on request', async () => {
  await render(CaptureStatus, { providers: apiTestProviders() });
  expect(screen.queryByRole('button')).toBeNull();
  TestBed.inject(Session).setUser({ id: 'u-1', email: 'sam@example.test', displayName: 'Sam Ortolan' });
  const queue = TestBed.inject(CaptureQueue);
  await queue.capture('b-1', [new File(['x'], 'blurry.jpg', { type: 'image/jpeg' })]);
  const message = 'blurry.jpg: This photo could not be read as an image.';
  const upload = await waitFor(() => TestBed.inject(HttpTestingController).expectOne('/api/builds/b-1/receipts'));
  upload.flush({ error: { code: 'validation_failed', message, fields: { 'files.0': message } } }, { status: 400, statusText: 'Bad Request' });

  const user = userEvent.setup();
  await user.click(await screen.findByRole('button', { name: 'Not sent (1)' }));
  expect(screen.getByText(message)).toBeTruthy();
  await user.click(screen.getByRole('menuitem', { name: 'Discard blurry.jpg' }));
  await waitFor(() => expect(screen.queryByRole('button', { name: /Not sent/ })).toBeNull());
  expect(queue.captures()).toEqual([]);
});
