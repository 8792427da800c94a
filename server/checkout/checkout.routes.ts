import { Router } from 'express';
import { CheckoutDto } from '../../shared/commerce/checkout.dto';
import { cartOwnerOf } from '../cart/cart-identity';
import type { Config } from '../config';
import { endpoint } from '../http/endpoint';
import type { PaymentProvider } from '../payments/payment-provider';
import { checkout } from './checkout.service';

export function checkoutRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.post('/', endpoint({ summary: 'Turn the cart into an order, hold its stock and open the payment page', body: CheckoutDto, status: 201 }, async ({ body }, req, res) => {
    res.status(201).json(await checkout(config, provider, cartOwnerOf(req), body));
  }));
  return r;
}
