// The service worker keeps copies of the build reads for use without signal (ngsw-config.json, data group
// "build-reads"). Once nobody is signed in they must go, so the next person on a shared phone cannot read them.

/** Deletes the service worker's cached API answers (its data-group caches); its copy of the app itself stays. */
export async function forgetCachedAnswers(): Promise<void> {
  if (typeof caches === 'undefined') return;
  for (const name of await caches.keys()) {
    // The Angular worker names each data group's cache "ngsw:<scope>:<version>:data:<group>:cache" (and ":age").
    if (name.startsWith('ngsw:') && name.includes(':data:')) await caches.delete(name);
  }
}
