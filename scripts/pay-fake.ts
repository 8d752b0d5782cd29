/**
 * A local stand-in for the hosted payment service, for development and tests only. It speaks
 * the few parts of the service's HTTP API that Brixhouse uses, so the official SDK talks to it
 * unchanged (STRIPE_API_HOST / STRIPE_API_PORT / STRIPE_API_PROTOCOL):
 *   POST /v1/checkout/sessions       create a checkout session (form-encoded, secret key as bearer)
 *   GET  /v1/checkout/sessions/:id   read it back
 *   GET  /checkout/:id               the hosted page: confirm or cancel the payment
 *   POST /checkout/:id/confirm       pays, sends checkout.session.completed to the app's webhook
 *                                    (signed with the SDK's own test-signing helper), then
 *                                    returns to success_url
 *   POST /checkout/:id/cancel        returns to cancel_url
 * Sessions live in memory. Listens on 127.0.0.1 only.
 */
import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';

const port = Number(process.env.PAY_PORT ?? 9400);
const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET ?? 'whsec_brixhouse_local_only';
const appUrl = (process.env.APP_URL ?? `http://127.0.0.1:${process.env.PORT ?? 3000}`).replace(/\/$/, '');
const webhookUrl = process.env.PAY_WEBHOOK_URL ?? `${appUrl}/api/payments/webhook`;
const base = `http://127.0.0.1:${port}`;
const signer = new Stripe('sk_test_signing_only');

interface Session {
  id: string;
  object: 'checkout.session';
  amount_total: number;
  currency: string;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  mode: string;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  cancel_url: string;
  url: string;
  created: number;
  description: string;
}

const sessions = new Map<string, Session>();
const id = (prefix: string) => `${prefix}_test_${randomBytes(12).toString('hex')}`;

function read(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    let body = '';
    req.setEncoding('utf8');
    req.on('data', (c) => (body += c));
    req.on('end', () => resolve(body));
    req.on('error', reject);
  });
}

function json(res: ServerResponse, status: number, body: unknown) {
  res.writeHead(status, { 'content-type': 'application/json' });
  res.end(JSON.stringify(body));
}

function apiError(res: ServerResponse, status: number, message: string, param?: string) {
  json(res, status, { error: { type: 'invalid_request_error', message, ...(param ? { param } : {}) } });
}

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function money(cents: number, currency: string) {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100);
}

function page(res: ServerResponse, status: number, title: string, body: string) {
  res.writeHead(status, { 'content-type': 'text/html; charset=utf-8' });
  res.end(`<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escape(title)}</title><style>
body{font-family:system-ui,sans-serif;max-width:30rem;margin:2rem auto;padding:0 1rem;color:#1d232a;background:#fafafa}
.card{background:#fff;border:1px solid #ccc;border-radius:12px;padding:1.25rem}
button{min-height:44px;padding:0 1.25rem;font-size:1rem;border-radius:8px;border:1px solid #333;cursor:pointer}
button.pay{background:#1d4ed8;color:#fff;border-color:#1d4ed8}
.row{display:flex;gap:.75rem;flex-wrap:wrap;margin-top:1rem}
.note{color:#555;font-size:.9rem}
</style></head><body><main class="card">${body}</main></body></html>`);
}

/** The form keys the SDK sends for the session Brixhouse creates (qs-style brackets). */
function createSession(form: URLSearchParams): Session | { error: string; param: string } {
  const success = form.get('success_url');
  const cancel = form.get('cancel_url');
  if (!success) return { error: 'Missing required param: success_url.', param: 'success_url' };
  if (!cancel) return { error: 'Missing required param: cancel_url.', param: 'cancel_url' };
  let amount = 0;
  let currency = '';
  const descriptions: string[] = [];
  for (let i = 0; form.has(`line_items[${i}][quantity]`) || form.has(`line_items[${i}][price_data][unit_amount]`); i++) {
    const unit = Number(form.get(`line_items[${i}][price_data][unit_amount]`));
    const quantity = Number(form.get(`line_items[${i}][quantity]`) ?? '1');
    if (!Number.isInteger(unit) || unit < 1) return { error: 'Invalid integer: unit_amount.', param: `line_items[${i}][price_data][unit_amount]` };
    if (!Number.isInteger(quantity) || quantity < 1) return { error: 'Invalid integer: quantity.', param: `line_items[${i}][quantity]` };
    amount += unit * quantity;
    currency = (form.get(`line_items[${i}][price_data][currency]`) ?? '').toLowerCase();
    descriptions.push(form.get(`line_items[${i}][price_data][product_data][name]`) ?? '');
  }
  if (amount === 0) return { error: 'You must provide at least one line item.', param: 'line_items' };
  if (!/^[a-z]{3}$/.test(currency)) return { error: 'Invalid currency.', param: 'currency' };
  const metadata: Record<string, string> = {};
  for (const [k, v] of form) {
    const m = /^metadata\[(.+)\]$/.exec(k);
    if (m) metadata[m[1]] = v;
  }
  const sid = id('cs');
  return {
    id: sid,
    object: 'checkout.session',
    amount_total: amount,
    currency,
    client_reference_id: form.get('client_reference_id'),
    metadata,
    mode: form.get('mode') ?? 'payment',
    payment_status: 'unpaid',
    status: 'open',
    success_url: success.replace('{CHECKOUT_SESSION_ID}', sid),
    cancel_url: cancel.replace('{CHECKOUT_SESSION_ID}', sid),
    url: `${base}/checkout/${sid}`,
    created: Math.floor(Date.now() / 1000),
    description: descriptions.filter(Boolean).join(', '),
  };
}

/** Sends the signed event to the app, retrying a few times as the real service would. */
async function deliver(session: Session): Promise<boolean> {
  const event = {
    id: id('evt'),
    object: 'event',
    api_version: '2025-01-01',
    created: Math.floor(Date.now() / 1000),
    livemode: false,
    type: 'checkout.session.completed',
    data: { object: session },
  };
  const payload = JSON.stringify(event);
  for (let attempt = 0; attempt < 4; attempt++) {
    try {
      const header = signer.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
      const res = await fetch(webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload });
      if (res.ok) return true;
      if (res.status >= 400 && res.status < 500) return false;
    } catch {
      /* the app is away; try again */
    }
    await new Promise((r) => setTimeout(r, 500 * 2 ** attempt));
  }
  return false;
}

const server = createServer(async (req, res) => {
  try {
    const url = new URL(req.url ?? '/', base);
    const path = url.pathname;
    if (req.method === 'GET' && path === '/health') return json(res, 200, { ok: true });

    if (path.startsWith('/v1/')) {
      if (!/^Bearer sk_(test|live)_\S+$/.test(req.headers.authorization ?? '')) {
        return json(res, 401, { error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' } });
      }
      if (req.method === 'POST' && path === '/v1/checkout/sessions') {
        const made = createSession(new URLSearchParams(await read(req)));
        if ('error' in made) return apiError(res, 400, made.error, made.param);
        sessions.set(made.id, made);
        return json(res, 200, made);
      }
      const m = /^\/v1\/checkout\/sessions\/([\w-]+)$/.exec(path);
      if (req.method === 'GET' && m) {
        const s = sessions.get(m[1]);
        return s ? json(res, 200, s) : apiError(res, 404, `No such checkout.session: '${m[1]}'`, 'id');
      }
      return apiError(res, 404, `Unrecognized request URL (${req.method}: ${path}).`);
    }

    const m = /^\/checkout\/([\w-]+)(?:\/(confirm|cancel))?$/.exec(path);
    const s = m ? sessions.get(m[1]) : undefined;
    if (!m || !s) return page(res, 404, 'Not found', '<h1>This checkout does not exist</h1>');
    if (req.method === 'GET' && !m[2]) {
      if (s.status !== 'open') {
        return page(res, 200, 'Checkout', `<h1>This checkout is ${s.status === 'complete' ? 'paid' : 'closed'}</h1><p><a href="${escape(s.success_url)}">Back to the shop</a></p>`);
      }
      return page(
        res,
        200,
        'Test checkout',
        `<p class="note">Test payment page (local stand-in, no money moves)</p>
<h1>Pay ${escape(money(s.amount_total, s.currency))}</h1>
<p>${escape(s.description)}</p>
<div class="row">
<form method="post" action="/checkout/${s.id}/confirm"><button class="pay" type="submit">Pay ${escape(money(s.amount_total, s.currency))}</button></form>
<form method="post" action="/checkout/${s.id}/cancel"><button type="submit">Cancel and go back</button></form>
</div>`,
      );
    }
    if (req.method === 'POST' && m[2] === 'cancel') {
      res.writeHead(303, { location: s.cancel_url });
      return res.end();
    }
    if (req.method === 'POST' && m[2] === 'confirm') {
      if (s.status === 'open') {
        s.status = 'complete';
        s.payment_status = 'paid';
        const ok = await deliver(s);
        if (!ok) {
          return page(res, 502, 'Payment taken', '<h1>Paid, but the shop did not confirm</h1><p>The payment was taken; the shop could not be told. Please contact the treasurer.</p>');
        }
      }
      res.writeHead(303, { location: s.success_url });
      return res.end();
    }
    return page(res, 405, 'Not allowed', '<h1>Not allowed</h1>');
  } catch (err) {
    console.error(err);
    json(res, 500, { error: { type: 'api_error', message: 'The test payment service failed.' } });
  }
});

server.listen(port, '127.0.0.1', () => console.log(`Test payment service on ${base} (webhook to ${webhookUrl})`));
for (const sig of ['SIGTERM', 'SIGINT'] as const) process.on(sig, () => server.close(() => process.exit(0)));
