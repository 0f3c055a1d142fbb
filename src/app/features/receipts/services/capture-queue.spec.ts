// The capture queue: a photo is saved in IndexedDB before it is sent, waits there without signal (across a reload),
// goes out under one Idempotency-Key however often it is sent, and leaves only once the server has it, or when the
// person discards a capture the server refused.
import { TestBed } from '@angular/core/testing';
import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { waitFor } from '@testing-library/angular/zoneless';
import { clear, createStore, keys } from 'idb-keyval';
import { apiTestProviders } from '../../../../testing/api-test-providers';
import { testReceipt } from '../../../../testing/build-fixtures';
import { Session } from '../../../core/auth/session';
import { CAPTURE_DATABASE, CaptureQueue } from './capture-queue';

const store = createStore(CAPTURE_DATABASE.name, CAPTURE_DATABASE.store);
const SAM = { id: 'u-1', email: 'sam@example.test', displayName: 'Sam Ortolan' };
let online = true;
Object.defineProperty(navigator, 'onLine', { configurable: true, get: () => online });

/** A fresh app (as after a reload) with Sam signed in; IndexedDB keeps what earlier ones saved. */
function startApp(user = SAM) {
  TestBed.resetTestingModule();
  TestBed.configureTestingModule({ providers: apiTestProviders() });
  TestBed.inject(Session).setUser(user);
  return { queue: TestBed.inject(CaptureQueue), http: TestBed.inject(HttpTestingController) };
}

const photo = (name: string) => new File([`bytes of ${name}`], name, { type: 'image/jpeg' });
const keyOf = (request: TestRequest) => request.request.headers.get('Idempotency-Key');
const uploadTo = (http: HttpTestingController) => waitFor(() => http.expectOne({ method: 'POST', url: '/api/builds/b-1/receipts' }));
const saved = () => keys(store);

beforeEach(async () => {
  online = true;
  await clear(store);
});

describe('CaptureQueue', () => {
  it('keeps captures made without signal through a reload and sends each once when the connection returns', async () => {
    online = false;
    let app = startApp();
    await app.queue.capture('b-1', [photo('slip-a.jpg'), photo('slip-b.jpg')]);
    app.http.expectNone('/api/builds/b-1/receipts');
    expect(app.queue.waiting().map((capture) => capture.name)).toEqual(['slip-a.jpg', 'slip-b.jpg']);
    expect(await saved()).toHaveLength(2);

    app = startApp();
    await waitFor(() => expect(app.queue.waiting()).toHaveLength(2));
    online = true;
    window.dispatchEvent(new Event('online'));
    const first = await uploadTo(app.http);
    expect(keyOf(first)).toBe(`"${app.queue.waiting()[0].id}"`);
    expect(first.request.headers.get('ngsw-bypass')).toBe('true');
    expect(((first.request.body as FormData).get('files') as File).name).toBe('slip-a.jpg');
    first.flush({ receipts: [testReceipt('r-1')] }, { status: 201, statusText: 'Created' });
    const second = await uploadTo(app.http);
    second.flush({ receipts: [testReceipt('r-2')] }, { status: 201, statusText: 'Created' });
    await waitFor(() => expect(app.queue.captures()).toEqual([]));
    expect(await saved()).toEqual([]);
    app.http.verify();
  });

  it('sends a capture again under the same key after the server failed, and forgets it only once it arrived', async () => {
    const app = startApp();
    await app.queue.capture('b-1', [photo('slip.jpg')]);
    const failed = await uploadTo(app.http);
    failed.flush({ error: { code: 'internal', message: 'Try again.' } }, { status: 503, statusText: 'Unavailable' });
    await waitFor(() => expect(app.queue.waiting()).toHaveLength(1));
    expect(await saved()).toHaveLength(1);

    window.dispatchEvent(new Event('online'));
    const again = await uploadTo(app.http);
    expect(keyOf(again)).toBe(keyOf(failed));
    again.flush({ receipts: [testReceipt('r-1')] }, { status: 201, statusText: 'Created' });
    await waitFor(() => expect(app.queue.captures()).toEqual([]));
    expect(await saved()).toEqual([]);
    app.http.verify();
  });

  it('keeps a refused capture with the reason until the person discards it', async () => {
    const app = startApp();
    await app.queue.capture('b-1', [photo('notes.jpg')]);
    const message = 'notes.jpg: This file is not a photo or PDF we can read.';
    (await uploadTo(app.http)).flush({ error: { code: 'validation_failed', message, fields: { 'files.0': message } } }, { status: 400, statusText: 'Bad Request' });
    await waitFor(() => expect(app.queue.refused().map((capture) => capture.problem)).toEqual([message]));
    expect(app.queue.waiting()).toEqual([]);
    expect(await saved()).toHaveLength(1);

    await app.queue.discard(app.queue.refused()[0].id);
    expect(app.queue.captures()).toEqual([]);
    expect(await saved()).toEqual([]);
  });

  it('sends a photo at once, unqueued, when nobody is signed in any more, so it is never dropped unseen', async () => {
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({ providers: apiTestProviders() });
    const queue = TestBed.inject(CaptureQueue);
    await queue.capture('b-1', [photo('slip.jpg')]);
    const upload = TestBed.inject(HttpTestingController).expectOne({ method: 'POST', url: '/api/builds/b-1/receipts' });
    expect(upload.request.headers.has('Idempotency-Key')).toBe(false);
    expect(queue.captures()).toEqual([]);
    expect(await saved()).toEqual([]);
  });

  it('shows and sends only the signed-in person’s captures', async () => {
    online = false;
    await startApp().queue.capture('b-1', [photo('sams-slip.jpg')]);
    online = true;
    const other = startApp({ id: 'u-2', email: 'kit@example.test', displayName: 'Kit Varga' });
    await waitFor(() => expect(other.queue.captures()).toEqual([]));
    other.http.expectNone('/api/builds/b-1/receipts');
    expect(await saved()).toHaveLength(1);
  });
});
