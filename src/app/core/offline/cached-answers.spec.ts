// Signing out forgets the service worker's cached API answers and keeps its copy of the app.
import { forgetCachedAnswers } from './cached-answers';

describe('forgetCachedAnswers', () => {
  afterEach(() => {
    delete (globalThis as { caches?: unknown }).caches;
  });

  it('deletes only the data-group caches of the Angular worker', async () => {
    const names = ['ngsw:/:db:control', 'ngsw:/:1:assets:shell:cache', 'ngsw:/:1:data:build-reads:cache', 'ngsw:/:1:data:build-reads:age', 'other:data:x'];
    const deleted: string[] = [];
    (globalThis as { caches?: unknown }).caches = {
      keys: async () => names,
      delete: async (name: string) => deleted.push(name) > 0,
    };
    await forgetCachedAnswers();
    expect(deleted).toEqual(['ngsw:/:1:data:build-reads:cache', 'ngsw:/:1:data:build-reads:age']);
  });

  it('does nothing where the browser has no Cache Storage', async () => {
    await expect(forgetCachedAnswers()).resolves.toBeUndefined();
  });
});
