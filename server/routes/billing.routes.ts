import express, { type Response } from 'express';
import { changeSeatsSchema, startSubscriptionSchema, updatePaymentMethodSchema } from '../../shared/api/billing.schema.js';
import { getOverview, listInvoices } from '../billing/overview.service.js';
import { changeSeats, startSubscription, updatePaymentMethod } from '../billing/subscription.service.js';
import { handleWebhook } from '../billing/webhook.service.js';
import type { AppDeps } from '../deps.js';
import type { RouteSpec } from '../http/route-table.js';

/** Seats and billing (admins only), and the payment provider's signed webhook (public, no CSRF). */
export function billingRoutes(deps: AppDeps): RouteSpec[] {
  const overview = (studioId: number) => getOverview(deps, studioId);
  return [
    {
      method: 'get',
      path: '/billing',
      access: ['admin'],
      summary: 'Plan, seats used and paid, subscription state, card on file, upcoming and past invoices',
      handler: (req) => overview(req.actor!.studioId),
    },
    {
      method: 'get',
      path: '/billing/invoices',
      access: ['admin'],
      summary: "The studio's invoices, newest first",
      handler: async (req) => ({ invoices: await listInvoices(deps, req.actor!.studioId) }),
    },
    {
      method: 'post',
      path: '/billing/subscription',
      access: ['admin'],
      summary: 'Start the seat subscription with a number of seats and a card',
      handler: async (req, res: Response) => {
        await startSubscription(deps, req.actor!, startSubscriptionSchema.parse(req.body));
        res.status(201);
        return overview(req.actor!.studioId);
      },
    },
    {
      method: 'patch',
      path: '/billing/seats',
      access: ['admin'],
      summary: 'Add or remove seats (never below the seats in use); prorated on the next invoice',
      handler: async (req) => {
        await changeSeats(deps, req.actor!, changeSeatsSchema.parse(req.body).quantity);
        return overview(req.actor!.studioId);
      },
    },
    {
      method: 'post',
      path: '/billing/payment-method',
      access: ['admin'],
      summary: 'Replace the card on file and retry an unpaid invoice',
      handler: async (req) => {
        await updatePaymentMethod(deps, req.actor!, updatePaymentMethodSchema.parse(req.body).paymentMethod);
        return overview(req.actor!.studioId);
      },
    },
    {
      method: 'post',
      path: '/billing/webhook',
      access: 'public',
      csrf: false,
      // The signature covers the exact bytes sent, so this route reads the raw body itself.
      before: [express.raw({ type: '*/*', limit: '1mb' })],
      summary: "The payment provider's signed events",
      handler: (req) => handleWebhook(deps, Buffer.isBuffer(req.body) ? req.body : Buffer.alloc(0), req.get('stripe-signature')),
    },
  ];
}
