import { Router } from 'express';
import { CheckoutDto } from '../../shared/commerce/checkout.dto';
import { cartOwnerOf } from '../cart/cart-identity';
import type { Config } from '../config';
import { parseBody } from '../http/validate';
import type { PaymentProvider } from '../payments/payment-provider';
import { checkout } from './checkout.service';

export function checkoutRoutes(config: Config, provider: PaymentProvider): Router {
  const r = Router();
  r.post('/', async (req, res) => {
    const dto = await parseBody(CheckoutDto, req.body);
    res.status(201).json(await checkout(config, provider, cartOwnerOf(req), dto));
  });
  return r;
}
