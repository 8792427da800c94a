import { PasswordResetToken } from '../accounts/PasswordResetToken.entity';
import { User } from '../accounts/User.entity';
import { AuditEntry } from '../audit/AuditEntry.entity';
import { AdapterNeed } from '../catalogue/AdapterNeed.entity';
import { Product } from '../catalogue/Product.entity';
import { ProductImage } from '../catalogue/ProductImage.entity';
import { SpringFitOverride } from '../catalogue/SpringFitOverride.entity';
import { Bike } from '../fitment/Bike.entity';
import { Fitment } from '../fitment/Fitment.entity';
import { Cart } from '../cart/Cart.entity';
import { CartLine } from '../cart/CartLine.entity';
import { SpringSet } from '../cart/SpringSet.entity';
import { Order } from '../orders/Order.entity';
import { OrderLine } from '../orders/OrderLine.entity';
import { Refund } from '../orders/Refund.entity';
import { PaymentEvent } from '../payments/PaymentEvent.entity';
import { ShopSettings } from '../shop/ShopSettings.entity';

import { MailOutbox } from '../mail/MailOutbox.entity';
import { RiderBike } from '../bikes/RiderBike.entity';
import { RiderBikeSagCheck } from '../bikes/RiderBikeSagCheck.entity';

import { Exchange } from '../exchanges/Exchange.entity';
import { StockMovement } from '../stock/StockMovement.entity';
import { Shipment } from '../warehouse/Shipment.entity';

export const entities = [User, PasswordResetToken, Bike, Fitment, Product, ProductImage, SpringFitOverride, AdapterNeed, AuditEntry, MailOutbox, ShopSettings, SpringSet, Cart, CartLine, Order, OrderLine, Refund, PaymentEvent, RiderBike, RiderBikeSagCheck, StockMovement, Shipment, Exchange];
