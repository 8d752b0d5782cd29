import 'server-only';
import Stripe from 'stripe';
import { env } from '@/lib/env';

const globalForPay = globalThis as unknown as { __brixhousePay?: Stripe };

/**
 * The payment service's official SDK, configured from the environment: keys from
 * STRIPE_SECRET_KEY, and the service's address from STRIPE_API_HOST / _PORT / _PROTOCOL (the
 * local stand-in in development and tests; unset for the real service).
 */
export function paymentClient(): Stripe {
  if (!globalForPay.__brixhousePay) {
    const e = env();
    globalForPay.__brixhousePay = new Stripe(e.STRIPE_SECRET_KEY, {
      ...(e.STRIPE_API_HOST ? { host: e.STRIPE_API_HOST } : {}),
      ...(e.STRIPE_API_PORT ? { port: e.STRIPE_API_PORT } : {}),
      ...(e.STRIPE_API_PROTOCOL ? { protocol: e.STRIPE_API_PROTOCOL } : {}),
      maxNetworkRetries: 2,
      timeout: 10_000,
    });
  }
  return globalForPay.__brixhousePay;
}
