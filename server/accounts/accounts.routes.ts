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
import { parseBody, uuidParam } from '../http/validate';
import * as accounts from './accounts.service';

export function authRoutes(config: Config): Router {
  const r = Router();
  const perIp = limiter({ windowMs: 15 * 60_000, limit: config.loginLimitPerIp });
  const perAccount = limiter({
    windowMs: 15 * 60_000,
    limit: config.loginLimitPerAccount,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => (typeof req.body?.email === 'string' ? accounts.normaliseEmail(req.body.email).slice(0, 254) : 'no-email'),
  });

  r.post('/register', perIp, async (req, res) => {
    const dto = await parseBody(RegisterDto, req.body);
    const s = await accounts.registerRider(config, dto);
    setSessionCookie(res, config, s.token);
    res.status(201).json(s);
  });

  r.post('/login', perIp, perAccount, async (req, res) => {
    const dto = await parseBody(LoginDto, req.body);
    const s = await accounts.signIn(config, dto.email, dto.password);
    setSessionCookie(res, config, s.token);
    res.json(s);
  });

  r.post('/logout', (_req, res) => {
    clearSessionCookie(res, config);
    res.status(204).end();
  });

  r.get('/me', (req, res) => {
    res.json({ user: accounts.toUserDto(requireUser(req)) });
  });

  r.post('/password-reset/request', perIp, async (req, res) => {
    const dto = await parseBody(PasswordResetRequestDto, req.body);
    await accounts.requestPasswordReset(dto.email, config);
    res.status(202).json({ message: 'If an account uses this e-mail, a reset link is on its way.' });
  });

  r.post('/password-reset/confirm', perIp, async (req, res) => {
    const dto = await parseBody(PasswordResetConfirmDto, req.body);
    await accounts.confirmPasswordReset(dto.token, dto.password);
    res.status(204).end();
  });

  return r;
}

export function adminUserRoutes(): Router {
  const r = Router();
  r.use(requireRole('admin'));

  r.get('/', async (_req, res) => {
    res.json({ items: await accounts.listUsers() });
  });

  r.post('/', async (req, res) => {
    const dto = await parseBody(CreateUserDto, req.body);
    res.status(201).json(await accounts.createUserByAdmin(dto));
  });

  r.patch('/:id', async (req, res) => {
    const id = uuidParam(req.params.id, 'The account');
    const dto = await parseBody(UpdateUserDto, req.body);
    res.json(await accounts.updateUserByAdmin(requireUser(req).id, id, dto));
  });

  return r;
}
