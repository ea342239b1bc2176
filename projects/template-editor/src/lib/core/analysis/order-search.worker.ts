import { boardOrderSearch, type OrderSearchAnswer, type OrderSearchRequest } from './order-search-runner';

/*
 * The board's order search, off the page's main thread (see OrderSearchRunner). Requests that arrive
 * while a search runs wait in the message queue; only the newest of them is searched (the page drops
 * answers to the others by id).
 */
let latest: OrderSearchRequest | null = null;
let scheduled = false;

addEventListener('message', (event: MessageEvent<OrderSearchRequest>) => {
  if (!latest || event.data.id > latest.id) latest = event.data;
  if (scheduled) return;
  scheduled = true;
  // Let every queued message land first, so a burst of requests costs one search.
  setTimeout(() => {
    scheduled = false;
    const request = latest;
    latest = null;
    if (request) {
      const answer: OrderSearchAnswer = { id: request.id, result: boardOrderSearch(request.section) };
      postMessage(answer);
    }
  });
});
