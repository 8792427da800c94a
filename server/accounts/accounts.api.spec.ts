import jwt from 'jsonwebtoken';
import { describe, expect, it } from 'vitest';
import { seedDemo } from '../../seeds/demo';
import { AppDataSource } from '../db/data-source';
import { createUser, testApp, testPassword, userWithToken } from '../test/factories';
import { PasswordResetToken } from './PasswordResetToken.entity';
import { confirmPasswordReset, requestPasswordReset } from './accounts.service';

const megabyte = 'x'.repeat(1024 * 1024);

describe('signing in', () => {
  it('every seeded demo account signs in with the demo password and gets a token and a cookie', async () => {
    await AppDataSource.transaction((em) => seedDemo(em));
    const { http } = testApp();
    for (const [email, role] of [
      ['rider@demo.test', 'rider'],
      ['staff@demo.test', 'staff'],
      ['warehouse@demo.test', 'warehouse'],
      ['admin@demo.test', 'admin'],
    ]) {
      const res = await http.post('/api/auth/login').send({ email, password: 'loadline-demo' });
      expect(res.status, email).toBe(200);
      expect(res.body.user).toMatchObject({ email, role });
      expect(res.body.token).toMatch(/^ey/);
      expect(res.body.user.passwordHash).toBeUndefined();
      const cookie = String(res.headers['set-cookie']);
      expect(cookie).toContain('loadline_session=');
      expect(cookie).toContain('HttpOnly');
      expect(cookie).toContain('SameSite=Lax');
    }
  });

  it('a wrong password and an unknown e-mail get the same answer', async () => {
    await createUser({ email: 'known@example.test' });
    const { http } = testApp();
    const wrong = await http.post('/api/auth/login').send({ email: 'known@example.test', password: 'not-the-password' });
    const unknown = await http.post('/api/auth/login').send({ email: 'nobody@example.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('the e-mail is matched whatever its case', async () => {
    await createUser({ email: 'mixed@example.test' });
    const res = await testApp().http.post('/api/auth/login').send({ email: 'MiXeD@Example.TEST', password: testPassword });
    expect(res.status).toBe(200);
  });

  it('repeated failures for one account are throttled even from fresh sessions', async () => {
    await createUser({ email: 'target@example.test' });
    const { http } = testApp({ loginLimitPerAccount: 3, loginLimitPerIp: 1000 });
    for (let i = 0; i < 3; i++) {
      expect((await http.post('/api/auth/login').send({ email: 'target@example.test', password: 'guess-' + i })).status).toBe(401);
    }
    const blocked = await http.post('/api/auth/login').send({ email: 'target@example.test', password: testPassword });
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('rate-limited');
  });

  it('sign-ins from one address are throttled across accounts', async () => {
    const { http } = testApp({ loginLimitPerIp: 2, loginLimitPerAccount: 1000 });
    await http.post('/api/auth/login').send({ email: 'a@example.test', password: 'x' });
    await http.post('/api/auth/login').send({ email: 'b@example.test', password: 'x' });
    expect((await http.post('/api/auth/login').send({ email: 'c@example.test', password: 'x' })).status).toBe(429);
  });

  it('a disabled account cannot sign in', async () => {
    await createUser({ email: 'off@example.test', disabled: true });
    const res = await testApp().http.post('/api/auth/login').send({ email: 'off@example.test', password: testPassword });
    expect(res.status).toBe(403);
  });
});

describe('registering', () => {
  it('a rider registers, is signed in by the cookie and sees themself at /me', async () => {
    const { app } = testApp();
    const request = (await import('supertest')).default;
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/register').send({ email: 'New@Example.test', password: 'long-enough-pw', displayName: 'New Rider' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new@example.test', role: 'rider', displayName: 'New Rider' });
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('new@example.test');
    await agent.post('/api/auth/logout').expect(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('an e-mail already used, in any case, is refused on its field', async () => {
    await createUser({ email: 'taken@example.test' });
    const res = await testApp().http.post('/api/auth/register').send({ email: 'TAKEN@example.test', password: 'long-enough-pw', displayName: 'X' });
    expect(res.status).toBe(409);
    expect(res.body.fields.email).toMatch(/already exists/);
  });

  it('a rider cannot give themself a role when registering', async () => {
    const res = await testApp().http.post('/api/auth/register').send({ email: 'sneaky@example.test', password: 'long-enough-pw', displayName: 'X', role: 'admin' });
    expect(res.status).toBe(400);
    expect(res.body.fields.role).toMatch(/not a field this request accepts/);
  });
});

describe('bad bodies on the auth routes get 400 with a message per field, never a 500', () => {
  const cases: [string, string, unknown, string[]][] = [
    ['login with nothing', '/api/auth/login', {}, ['email', 'password']],
    ['login with wrong types', '/api/auth/login', { email: 42, password: { a: 1 } }, ['email', 'password']],
    ['login with 1 MB strings', '/api/auth/login', { email: megabyte, password: megabyte }, ['email', 'password']],
    ['login with an unknown field', '/api/auth/login', { email: 'a@b.test', password: 'x', admin: true }, ['admin']],
    ['register with nothing', '/api/auth/register', {}, ['email', 'password', 'displayName']],
    ['register with wrong types', '/api/auth/register', { email: [], password: 12345678901, displayName: null }, ['email', 'password', 'displayName']],
    ['register with 1 MB strings', '/api/auth/register', { email: megabyte, password: megabyte, displayName: megabyte }, ['email', 'password', 'displayName']],
    ['reset request with a 1 MB string', '/api/auth/password-reset/request', { email: megabyte }, ['email']],
    ['reset confirm with nothing', '/api/auth/password-reset/confirm', {}, ['token', 'password']],
    ['register with a lone surrogate half as e-mail', '/api/auth/register', { email: '\ud800', password: 'long-enough-pw', displayName: 'R' }, ['email']],
    ['login with a lone surrogate half in the e-mail', '/api/auth/login', { email: 'a\udc00@b.test', password: 'x' }, ['email']],
    ['register with a NUL character in the name', '/api/auth/register', { email: 'nul@b.test', password: 'long-enough-pw', displayName: 'R\u0000' }, ['displayName']],
    ['register with a name of only spaces', '/api/auth/register', { email: 'blank@b.test', password: 'long-enough-pw', displayName: '   ' }, ['displayName']],
  ];
  it.each(cases)('%s', async (_name, path, body, fields) => {
    const res = await testApp().http.post(path).send(body as object);
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('validation');
    for (const f of fields) expect(typeof res.body.fields[f], f).toBe('string');
  });

  it('a body that is not JSON, or not an object, is refused plainly', async () => {
    const { http } = testApp();
    const broken = await http.post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": ');
    expect(broken.status).toBe(400);
    expect(broken.body.fields.body).toBeDefined();
    const array = await http.post('/api/auth/login').send([1, 2]);
    expect(array.status).toBe(400);
  });
});

describe('tokens and roles', () => {
  it('a rider token on an admin-only route is 403; no token is 401', async () => {
    const { http, config } = testApp();
    const { auth } = await userWithToken(config, 'rider');
    expect((await http.get('/api/admin/users').set(auth)).status).toBe(403);
    expect((await http.get('/api/admin/users')).status).toBe(401);
  });

  it('an admin token is let through and can create a staff account', async () => {
    const { http, config } = testApp();
    const { auth } = await userWithToken(config, 'admin');
    const res = await http.post('/api/admin/users').set(auth).send({ email: 'staffer@example.test', password: 'long-enough-pw', displayName: 'S', role: 'staff' });
    expect(res.status).toBe(201);
    expect(res.body.role).toBe('staff');
    expect((await http.get('/api/admin/users').set(auth)).body.items).toHaveLength(2);
  });

  it('a tampered, an expired and an alg-none token are all 401', async () => {
    const { http, config } = testApp();
    const { user, token } = await userWithToken(config, 'admin');
    const [h, p, s] = token.split('.') as [string, string, string];
    const claims = JSON.parse(Buffer.from(p, 'base64url').toString());
    const tampered = `${h}.${Buffer.from(JSON.stringify({ ...claims, role: 'admin', sub: claims.sub })).toString('base64url').replace(/.$/, 'A')}.${s}`;
    const expired = jwt.sign({ sub: user.id, role: 'admin', tv: 0, exp: Math.floor(Date.now() / 1000) - 10 }, config.jwtSecret, { algorithm: 'HS256' });
    const none = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${p}.`;
    const otherKey = jwt.sign({ sub: user.id, role: 'admin', tv: 0 }, 'some-other-secret-some-other-secret-00', { algorithm: 'HS256' });
    for (const bad of [tampered, expired, none, otherKey]) {
      const res = await http.get('/api/auth/me').set('Authorization', `Bearer ${bad}`);
      expect(res.status).toBe(401);
    }
    expect((await http.get('/api/auth/me').set('Authorization', `Bearer ${token}`)).status).toBe(200);
  });

  it('a role taken away by an admin ends the tokens issued before', async () => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const staff = await userWithToken(config, 'staff');
    await http.patch(`/api/admin/users/${staff.user.id}`).set(admin.auth).send({ role: 'rider' }).expect(200);
    expect((await http.get('/api/auth/me').set(staff.auth)).status).toBe(401);
  });

  it('an admin cannot disable their own account by writing its id in capitals', async () => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const res = await http.patch(`/api/admin/users/${admin.user.id.toUpperCase()}`).set(admin.auth).send({ disabled: true });
    expect(res.status).toBe(409);
    expect((await http.get('/api/auth/me').set(admin.auth)).status).toBe(200);
  });

  it('an account id that is not a UUID is not found', async () => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    for (const id of ['abc', '%00', `${admin.user.id}x`]) {
      expect((await http.patch(`/api/admin/users/${id}`).set(admin.auth).send({ displayName: 'X' })).status).toBe(404);
    }
  });

  it.each([
    ['a null role', { role: null }, 'role'],
    ['a null disabled flag', { disabled: null }, 'disabled'],
    ['a null name', { displayName: null }, 'displayName'],
    ['a name of only spaces', { displayName: '  ' }, 'displayName'],
  ])('an admin edit with %s is a 400 on that field and the account is unchanged', async (_name, body, field) => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const staff = await userWithToken(config, 'staff');
    const res = await http.patch(`/api/admin/users/${staff.user.id}`).set(admin.auth).send(body);
    expect(res.status).toBe(400);
    expect(typeof res.body.fields[field]).toBe('string');
    const after = (await http.get('/api/admin/users').set(admin.auth)).body.items.find((u: { id: string }) => u.id === staff.user.id);
    expect(after).toMatchObject({ role: 'staff', disabled: false, displayName: 'Test Rider' });
  });

  it('a state-changing request sent from another site is refused', async () => {
    const res = await testApp().http.post('/api/auth/login').set('Origin', 'https://evil.example').send({ email: 'a@b.test', password: 'x' });
    expect(res.status).toBe(403);
  });
});

describe('password reset', () => {
  it('a reset token works once, sets the new password and ends old sign-ins', async () => {
    const { http, config } = testApp();
    const { user, auth } = await userWithToken(config, 'rider', { email: 'forgetful@example.test' });
    const reply = await http.post('/api/auth/password-reset/request').send({ email: 'forgetful@example.test' });
    expect(reply.status).toBe(202);
    const issued = await requestPasswordReset('forgetful@example.test');
    expect(issued?.user.id).toBe(user.id);
    await http.post('/api/auth/password-reset/confirm').send({ token: issued!.token, password: 'a-brand-new-pw' }).expect(204);
    expect((await http.post('/api/auth/login').send({ email: 'forgetful@example.test', password: 'a-brand-new-pw' })).status).toBe(200);
    expect((await http.get('/api/auth/me').set(auth)).status).toBe(401);
    const again = await http.post('/api/auth/password-reset/confirm').send({ token: issued!.token, password: 'yet-another-pw' });
    expect(again.status).toBe(400);
    expect(again.body.fields.token).toBeDefined();
  });

  it('an expired reset token is refused', async () => {
    await createUser({ email: 'late@example.test' });
    const issued = await requestPasswordReset('late@example.test');
    await AppDataSource.getRepository(PasswordResetToken).update({ userId: issued!.user.id }, { expiresAt: new Date(Date.now() - 1000) });
    await expect(confirmPasswordReset(issued!.token, 'a-brand-new-pw')).rejects.toMatchObject({ kind: 'validation' });
  });

  it('asking for an unknown e-mail answers the same as for a known one and stores nothing', async () => {
    const res = await testApp().http.post('/api/auth/password-reset/request').send({ email: 'ghost@example.test' });
    expect(res.status).toBe(202);
    expect(await AppDataSource.getRepository(PasswordResetToken).count()).toBe(0);
  });
});
