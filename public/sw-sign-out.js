/* Loaded by the service worker (importScripts). When the person signs out (the form posts to
 * /logout), empty the caches of pages and records they opened, and this device's copies of their
 * records. Never the outbox: what waits is sent at that person's next sign-in. */
self.addEventListener('fetch', (event) => {
  const url = new URL(event.request.url);
  if (event.request.method !== 'POST' || url.origin !== self.location.origin || url.pathname !== '/logout') return;
  const clearCopies = new Promise((resolve) => {
    const open = indexedDB.open('bondmap-field');
    open.onerror = () => resolve();
    open.onsuccess = () => {
      const db = open.result;
      if (!db.objectStoreNames.contains('records')) return resolve(db.close());
      const tx = db.transaction('records', 'readwrite');
      tx.objectStore('records').clear();
      tx.oncomplete = tx.onerror = () => resolve(db.close());
    };
  });
  event.waitUntil(Promise.all([caches.delete('bondmap-person-pages'), caches.delete('bondmap-person-data'), clearCopies]));
});
