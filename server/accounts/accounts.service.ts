import bcrypt from 'bcryptjs';
import { createHash, randomBytes } from 'node:crypto';
import { IsNull, MoreThan, type EntityManager } from 'typeorm';
import type { CreateUserDto, RegisterDto, UpdateUserDto } from '../../shared/dto/auth.dto';
import type { Role, SessionDto, UserDto } from '../../shared/roles';
import { getConfig, type Config } from '../config';
import { AppDataSource } from '../db/data-source';
import { AppError } from '../errors';
import { enqueueMail } from '../mail/outbox';
import { getShopSettings } from '../shop/shop-settings.service';
import { passwordResetMail } from '../mail/templates/password-reset-mail';
import { PasswordResetToken } from './PasswordResetToken.entity';
import { signToken } from './tokens';
import { User } from './User.entity';

const bcryptCost = 10;
const resetTokenTtlMs = 60 * 60 * 1000;
// Compared against when the e-mail is unknown, so both failures take the same time.
const dummyHash = bcrypt.hashSync('not-a-real-password', bcryptCost);

export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    disabled: u.disabled,
    createdAt: u.createdAt.toISOString(),
  };
}

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

const users = () => AppDataSource.getRepository(User);

export async function findUserByEmail(email: string, em?: EntityManager): Promise<User | null> {
  return (em ?? AppDataSource.manager)
    .getRepository(User)
    .createQueryBuilder('u')
    .where('lower(u.email) = :email', { email: normaliseEmail(email) })
    .getOne();
}

export async function findUserById(id: string): Promise<User | null> {
  return users().findOneBy({ id });
}

function session(config: Config, user: User): SessionDto {
  const { token, expiresAt } = signToken(config, { sub: user.id, role: user.role, tv: user.tokenVersion });
  return { user: toUserDto(user), token, expiresAt: expiresAt.toISOString() };
}

async function createUser(input: { email: string; password: string; displayName: string; role: Role }): Promise<User> {
  const email = normaliseEmail(input.email);
  if (await findUserByEmail(email)) {
    throw new AppError('conflict', 'An account with this e-mail already exists.', { email: 'An account with this e-mail already exists.' });
  }
  const user = users().create({
    email,
    displayName: input.displayName.trim(),
    role: input.role,
    passwordHash: await bcrypt.hash(input.password, bcryptCost),
  });
  try {
    return await users().save(user);
  } catch (e) {
    // Two registrations racing for one e-mail: the unique index decides.
    if ((e as { code?: string }).code === '23505') {
      throw new AppError('conflict', 'An account with this e-mail already exists.', { email: 'An account with this e-mail already exists.' });
    }
    throw e;
  }
}

/** A rider signs up: the account is created and signed in. */
export async function registerRider(config: Config, dto: RegisterDto): Promise<SessionDto> {
  const user = await createUser({ ...dto, role: 'rider' });
  return session(config, user);
}

/** Signs in; a wrong password and an unknown e-mail get the same answer. */
export async function signIn(config: Config, email: string, password: string): Promise<SessionDto> {
  const user = await findUserByEmail(email);
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash);
  if (!user || !ok) throw new AppError('unauthorised', 'Wrong e-mail or password.');
  if (user.disabled) throw new AppError('forbidden', 'This account is disabled. Please contact the shop.');
  return session(config, user);
}

export async function createUserByAdmin(dto: CreateUserDto): Promise<UserDto> {
  return toUserDto(await createUser(dto));
}

export async function listUsers(): Promise<UserDto[]> {
  return (await users().find({ order: { createdAt: 'ASC' } })).map(toUserDto);
}

export async function updateUserByAdmin(actorId: string, id: string, dto: UpdateUserDto): Promise<UserDto> {
  const user = await findUserById(id);
  if (!user) throw AppError.notFound('The account');
  if (actorId === id && (dto.disabled === true || (dto.role && dto.role !== 'admin'))) {
    throw new AppError('conflict', 'You cannot disable your own account or take away your own admin role.');
  }
  if (dto.role !== undefined) user.role = dto.role;
  if (dto.disabled !== undefined) user.disabled = dto.disabled;
  if (dto.displayName !== undefined) user.displayName = dto.displayName.trim();
  // A changed role or a disabled account must not keep working through old tokens.
  if (dto.role !== undefined || dto.disabled) user.tokenVersion += 1;
  return toUserDto(await users().save(user));
}

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/**
 * Creates a single-use reset token when the e-mail belongs to an account and mails the link through the outbox, in
 * one transaction. Returns the raw token; callers never tell the requester whether the account exists.
 */
export async function requestPasswordReset(
  email: string,
  config: Pick<Config, 'publicOrigin'> = getConfig(),
): Promise<{ user: UserDto; token: string } | undefined> {
  const user = await findUserByEmail(email);
  if (!user || user.disabled) return undefined;
  const token = randomBytes(32).toString('base64url');
  await AppDataSource.transaction(async (em) => {
    const row = await em.getRepository(PasswordResetToken).save({
      userId: user.id,
      tokenHash: hashToken(token),
      expiresAt: new Date(Date.now() + resetTokenTtlMs),
      usedAt: null,
    });
    const shop = await getShopSettings(em);
    const mail = passwordResetMail({
      displayName: user.displayName,
      resetUrl: `${config.publicOrigin}/reset-password?token=${encodeURIComponent(token)}`,
      validForMinutes: resetTokenTtlMs / 60_000,
      shop: { name: shop.shopName, address: shop.shopAddress },
    });
    await enqueueMail(em, `password-reset:${row.id}`, { to: user.email, ...mail });
  });
  return { user: toUserDto(user), token };
}

/** Sets a new password with a reset token; the token is spent and older sign-ins end. */
export async function confirmPasswordReset(token: string, password: string): Promise<void> {
  const passwordHash = await bcrypt.hash(password, bcryptCost);
  await AppDataSource.transaction(async (em) => {
    const row = await em.getRepository(PasswordResetToken).findOne({
      where: { tokenHash: hashToken(token), usedAt: IsNull(), expiresAt: MoreThan(new Date()) },
      lock: { mode: 'pessimistic_write' },
    });
    if (!row) {
      throw AppError.validation('This reset link is not valid any more. Ask for a new one.', { token: 'expired, used or unknown' });
    }
    row.usedAt = new Date();
    await em.save(row);
    await em
      .getRepository(User)
      .createQueryBuilder()
      .update()
      .set({ passwordHash, tokenVersion: () => 'token_version + 1' })
      .where('id = :id', { id: row.userId })
      .execute();
  });
}
