// Runs before the app's code: on the athlete's My week (the page a phone opens most), asks for the
// signed-in user and the week at once, so the answers are on their way while the code still downloads.
// A page with the first glance (drawn by the server) carries both already, and does nothing here.
// Plain JavaScript served as is, loaded async from the page's head; src/lib/early-requests.ts hands the
// answers over to the API client, which takes each one once.
/* global window, document, location, fetch, URLSearchParams */
(() => {
  const early = {};
  const start = (url) => {
    const res = fetch(url, { credentials: 'same-origin', headers: { Accept: 'application/json' } });
    // Not taken (or failed): the app asks again itself, so nothing is reported here.
    res.catch(() => undefined);
    early[url] = res;
  };
  // With a first glance the server drew the week into the page and named the page's code itself.
  const glance = document.querySelector('meta[name="rackturn-first-glance"]') !== null;
  if (location.pathname === '/my-week' && !glance) {
    const week = new URLSearchParams(location.search).get('week');
    start('/api/auth/me');
    start(week && /^\d{4}-W\d{2}$/.test(week) ? `/api/my-week?week=${encodeURIComponent(week)}` : '/api/my-week');
    // The page's own code too (named by the build), fetched beside the app's instead of after it has run
    // (after the data, which matters most and would otherwise queue behind these files).
    const code = document.querySelector('meta[name="rackturn-my-week-code"]');
    for (const href of (code?.getAttribute('content') ?? '').split(' ').filter(Boolean)) {
      const link = document.createElement('link');
      link.rel = 'modulepreload';
      link.href = href;
      document.head.appendChild(link);
    }
  }
  window.__rackturnEarly = early;
})();
