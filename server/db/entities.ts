import { PasswordResetToken } from '../accounts/PasswordResetToken.entity';
import { User } from '../accounts/User.entity';

export const entities = [User, PasswordResetToken];
