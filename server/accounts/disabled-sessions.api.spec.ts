import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createUser, testApp, testPassword, userWithToken } from '../test/factories';

// The sign-in middleware reads the account on every request (one primary-key lookup, no cache) and refuses a token
// whose account is disabled or whose token version moved, so a disable holds on the next request on every server.
describe('a disabled account', () => {
  it('loses its Bearer token and its session cookie on the very next request', async () => {
    const { app, http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const staff = await createUser({ role: 'staff', email: 'counter@example.test' });
    const browser = request.agent(app);
    const signIn = await browser.post('/api/auth/login').send({ email: staff.email, password: testPassword }).expect(200);
    const bearer = { Authorization: `Bearer ${signIn.body.token as string}` };
    await browser.get('/api/staff/products').expect(200);
    await http.get('/api/staff/products').set(bearer).expect(200);

    await http.patch(`/api/admin/users/${staff.id}`).set(admin.auth).send({ disabled: true }).expect(200);

    expect((await http.get('/api/staff/products').set(bearer)).status).toBe(401);
    expect((await http.get('/api/auth/me').set(bearer)).status).toBe(401);
    // The cookie now reads as signed out.
    expect((await browser.get('/api/staff/products')).status).toBe(401);
    expect((await browser.get('/api/auth/me')).status).toBe(401);
    // And it cannot sign in again.
    expect((await browser.post('/api/auth/login').send({ email: staff.email, password: testPassword })).status).toBe(403);
  });

  it('enabled again, its old tokens stay refused: only a new sign-in works', async () => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const rider = await userWithToken(config, 'rider');
    await http.patch(`/api/admin/users/${rider.user.id}`).set(admin.auth).send({ disabled: true }).expect(200);
    await http.patch(`/api/admin/users/${rider.user.id}`).set(admin.auth).send({ disabled: false }).expect(200);
    expect((await http.get('/api/auth/me').set(rider.auth)).status).toBe(401);
    const again = await http.post('/api/auth/login').send({ email: rider.user.email, password: testPassword }).expect(200);
    await http.get('/api/auth/me').set({ Authorization: `Bearer ${again.body.token as string}` }).expect(200);
  });

  it('a role taken away ends the sessions that carried it', async () => {
    const { http, config } = testApp();
    const admin = await userWithToken(config, 'admin');
    const staff = await userWithToken(config, 'staff');
    await http.get('/api/staff/products').set(staff.auth).expect(200);
    await http.patch(`/api/admin/users/${staff.user.id}`).set(admin.auth).send({ role: 'rider' }).expect(200);
    expect((await http.get('/api/staff/products').set(staff.auth)).status).toBe(401);
  });
});
