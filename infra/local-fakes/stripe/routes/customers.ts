import { Router } from 'express';
import { z } from 'zod';
import { currencyParam, expandParam, listParams, mergeMetadata, metadataParam, parseParams } from '../params';
import { paginate } from '../pagination';
import { renderCustomer } from '../render';
import { resourceMissing } from '../stripe-error';
import { type CustomerRecord, newId, newInvoicePrefix, nowSeconds } from '../store';
import { pathId, type RouteContext } from './route-context';

// API reference, "Customers": create, retrieve, update, delete, list.
const customerFields = {
  name: z.string().max(256).optional(),
  email: z.string().max(512).optional(),
  description: z.string().max(350).optional(),
  phone: z.string().max(20).optional(),
  metadata: metadataParam.optional(),
  expand: expandParam.optional(),
};

const createSchema = z.strictObject({ ...customerFields, currency: currencyParam.optional() });
const updateSchema = z.strictObject(customerFields);
const listSchema = z.strictObject({ ...listParams, email: z.string().optional() });
const retrieveSchema = z.strictObject({ expand: expandParam.optional() });

export function customerRoutes(context: RouteContext): Router {
  const router = Router();
  const { store } = context;

  const find = (id: string): CustomerRecord => {
    const customer = store.data.customers[id];
    if (!customer || customer.deleted) throw resourceMissing('customer', id);
    return customer;
  };

  router.post('/v1/customers', (req, res) => {
    const params = parseParams(createSchema, req.body);
    const customer: CustomerRecord = {
      id: newId('cus'),
      created: nowSeconds(),
      name: params.name ?? null,
      email: params.email ?? null,
      description: params.description ?? null,
      phone: params.phone ?? null,
      currency: params.currency ?? null,
      invoice_prefix: newInvoicePrefix(),
      next_invoice_sequence: 1,
      metadata: mergeMetadata({}, params.metadata),
    };
    store.data.customers[customer.id] = customer;
    store.changed();
    res.json(renderCustomer(customer));
  });

  router.get('/v1/customers/:id', (req, res) => {
    parseParams(retrieveSchema, req.query);
    const customer = store.data.customers[pathId(req)];
    if (!customer) throw resourceMissing('customer', pathId(req));
    res.json(renderCustomer(customer));
  });

  router.post('/v1/customers/:id', (req, res) => {
    const params = parseParams(updateSchema, req.body);
    const customer = find(pathId(req));
    if (params.name !== undefined) customer.name = params.name || null;
    if (params.email !== undefined) customer.email = params.email || null;
    if (params.description !== undefined) customer.description = params.description || null;
    if (params.phone !== undefined) customer.phone = params.phone || null;
    customer.metadata = mergeMetadata(customer.metadata, params.metadata);
    store.changed();
    res.json(renderCustomer(customer));
  });

  router.delete('/v1/customers/:id', (req, res) => {
    const customer = find(pathId(req));
    customer.deleted = true;
    store.changed();
    res.json(renderCustomer(customer));
  });

  router.get('/v1/customers', (req, res) => {
    const params = parseParams(listSchema, req.query);
    const customers = Object.values(store.data.customers).filter(
      (c) => !c.deleted && (params.email === undefined || c.email === params.email),
    );
    res.json(paginate(customers, params, '/v1/customers', renderCustomer));
  });

  return router;
}
