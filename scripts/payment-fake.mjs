// The local payment fake (stripe-stateful-mock), bound to loopback only.
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const log = require('loglevel');
log.setLevel(process.env.LOG_LEVEL ?? 'warn');
const { createExpressApp } = require('stripe-stateful-mock');
const port = Number(process.env.PORT ?? 12111);
createExpressApp().listen(port, '127.0.0.1', () => console.log(`payment fake on http://127.0.0.1:${port}`));
