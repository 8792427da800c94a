import { PasswordResetToken } from '../accounts/PasswordResetToken.entity';
import { User } from '../accounts/User.entity';
import { AuditEntry } from '../audit/AuditEntry.entity';
import { AdapterNeed } from '../catalogue/AdapterNeed.entity';
import { Product } from '../catalogue/Product.entity';
import { ProductImage } from '../catalogue/ProductImage.entity';
import { SpringFitOverride } from '../catalogue/SpringFitOverride.entity';
import { Bike } from '../fitment/Bike.entity';
import { Fitment } from '../fitment/Fitment.entity';
import { MailOutbox } from '../mail/MailOutbox.entity';

export const entities = [User, PasswordResetToken, Bike, Fitment, Product, ProductImage, SpringFitOverride, AdapterNeed, AuditEntry, MailOutbox];
