import { Router } from 'express';
import {
  CreateUserDto,
  LoginDto,
  PasswordResetConfirmDto,
  PasswordResetRequestDto,
  RegisterDto,
  UpdateUserDto,
} from '../../shared/dto/auth.dto';
import type { Config } from '../config';
import { clearSessionCookie, requireRole, requireUser, setSessionCookie } from '../http/auth';
import { limiter } from '../http/rate-limit';
import { endpoint } from '../http/endpoint';
import * as accounts from './accounts.service';

export function authRoutes(config: Config): Router {
  const r = Router();
  const perIp = limiter({ name: 'sign-in-address', windowMs: 15 * 60_000, limit: config.loginLimitPerIp });
  const perAccount = limiter({
    name: 'sign-in-account',
    windowMs: 15 * 60_000,
    limit: config.loginLimitPerAccount,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => (typeof req.body?.email === 'string' ? accounts.normaliseEmail(req.body.email).slice(0, 254) : 'no-email'),
  });

  r.post('/register', perIp, endpoint({ summary: 'Open a rider account and sign in', body: RegisterDto, status: 201 }, async ({ body: dto }, _req, res) => {
    const s = await accounts.registerRider(config, dto);
    setSessionCookie(res, config, s.token);
    res.status(201).json(s);
  }));

  r.post('/login', perIp, perAccount, endpoint({ summary: 'Sign in with e-mail and password (a token and a session cookie)', body: LoginDto }, async ({ body: dto }, _req, res) => {
    const s = await accounts.signIn(config, dto.email, dto.password);
    setSessionCookie(res, config, s.token);
    res.json(s);
  }));

  r.post('/logout', endpoint({ summary: 'Sign out (clears the session cookie)', reply: 'none' }, (_input, _req, res) => {
    clearSessionCookie(res, config);
    res.status(204).end();
  }));

  r.get('/me', endpoint({ summary: 'The signed-in account', signedIn: true }, (_input, req, res) => {
    res.json({ user: accounts.toUserDto(requireUser(req)) });
  }));

  r.post('/password-reset/request', perIp, endpoint({ summary: 'Ask for a password reset link', body: PasswordResetRequestDto, status: 202 }, async ({ body: dto }, _req, res) => {
    await accounts.requestPasswordReset(dto.email, config);
    res.status(202).json({ message: 'If an account uses this e-mail, a reset link is on its way.' });
  }));

  r.post('/password-reset/confirm', perIp, endpoint({ summary: 'Set a new password with a reset token', body: PasswordResetConfirmDto, reply: 'none' }, async ({ body: dto }, _req, res) => {
    await accounts.confirmPasswordReset(dto.token, dto.password);
    res.status(204).end();
  }));

  return r;
}

export function adminUserRoutes(): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', endpoint({ summary: 'Every account' }, async (_input, _req, res) => {
    res.json({ items: await accounts.listUsers() });
  }));

  r.post('/', endpoint({ summary: 'Open an account with any role', body: CreateUserDto, status: 201 }, async ({ body }, _req, res) => {
    res.status(201).json(await accounts.createUserByAdmin(body));
  }));

  r.patch('/:id', endpoint({ summary: 'Change an account’s role, name or disabled flag', ids: { id: 'The account' }, body: UpdateUserDto }, async ({ ids, body }, req, res) => {
    res.json(await accounts.updateUserByAdmin(requireUser(req).id, ids.id, body));
  }));

  return r;
}
