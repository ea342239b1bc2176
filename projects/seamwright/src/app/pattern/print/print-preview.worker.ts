/// <reference lib="webworker" />
import { planPreview, type PreviewRequest } from './print-preview-plan';

/*
 * The print preview's planner, off the page's main thread. Requests that arrive while a plan runs
 * wait in the message queue; only the newest of them is planned (the page has dropped the others,
 * see PrintPreviewPlanner), and its answer carries the request's id.
 */
let latest: PreviewRequest | null = null;
let scheduled = false;

addEventListener('message', (event: MessageEvent<PreviewRequest>) => {
  if (!latest || event.data.id > latest.id) latest = event.data;
  if (scheduled) return;
  scheduled = true;
  // Let every queued message land first, so a burst of requests costs one plan.
  setTimeout(() => {
    scheduled = false;
    const request = latest;
    latest = null;
    if (request) postMessage(planPreview(request));
  });
});
