import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, TEST_ORIGIN, tokenFromMail, type Agent, type TestApp } from '../helpers/test-app';

// Mail travels over real SMTP (RFC 5321) on loopback to the built-in catcher, is parsed back
// (RFC 5322 headers, MIME multipart/alternative for text + HTML — from memory) and read from the outbox API.

describe('members and invitations by e-mail', () => {
  let t: TestApp;
  let admin: Agent;
  let owner: Agent;
  let boardId: number;

  beforeAll(async () => {
    t = await createTestApp();
    admin = await t.signUp('Mara Quinn', 'mara@larkspur.example'); // first account: site admin
    owner = await t.signUp('Theo Vance', 'theo@larkspur.example');
    boardId = (await owner.post('/api/boards').send({ title: 'Mux logic unit', family: 'tube-drl-nor' })).body.board.id;
  });
  afterAll(() => t.close());

  it('adds an existing account at once and mails them', async () => {
    await t.signUp('Ines Okafor', 'ines@larkspur.example');
    const res = await owner.post(`/api/boards/${boardId}/members`).send({ email: 'Ines@larkspur.example', role: 'editor' });
    expect(res.status).toBe(201);
    expect(res.body.member).toMatchObject({ email: 'ines@larkspur.example', name: 'Ines Okafor', role: 'editor' });
    const mail = await t.waitForMail('ines@larkspur.example', /added you/);
    expect(mail.subject).toBe('Theo Vance added you to "Mux logic unit"');
    expect(mail.text).toContain(`${TEST_ORIGIN}/boards/${boardId}`);
    expect(mail.html).toContain(`href="${TEST_ORIGIN}/boards/${boardId}"`);
    // a tube board: the mail carries the safety caution
    expect(mail.text).toMatch(/local electrical codes/);
    const again = await owner.post(`/api/boards/${boardId}/members`).send({ email: 'ines@larkspur.example', role: 'viewer' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_member');
  });

  it('invites an unknown address; the mail arrives over SMTP and is readable in the outbox API', async () => {
    const res = await owner.post(`/api/boards/${boardId}/members`).send({ email: 'calder@room14.example', role: 'viewer' });
    expect(res.status).toBe(201);
    expect(res.body.invitation).toMatchObject({ email: 'calder@room14.example', role: 'viewer' });

    await t.waitForMail('calder@room14.example', /invited you/);
    const list = await admin.get('/api/admin/outbox');
    expect(list.status).toBe(200);
    const summary = list.body.messages[0];
    expect(summary).toMatchObject({ to: 'calder@room14.example', subject: 'Theo Vance invited you to "Mux logic unit"' });
    expect(summary.from).toContain('no-reply@gatefold.invalid');
    expect(Object.keys(summary).sort()).toEqual(['date', 'from', 'id', 'subject', 'to']);
    const ids = list.body.messages.map((m: { id: number }) => m.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a)); // newest first

    const full = await admin.get(`/api/admin/outbox/${summary.id}`);
    expect(full.status).toBe(200);
    const token = tokenFromMail(full.body.message, 'invitations');
    expect(full.body.message.html).toContain(`${TEST_ORIGIN}/invitations/${token}`);
    // the token is stored only as a hash
    const stored = await t.ctx.db('invitations').where({ email: 'calder@room14.example' }).first();
    expect(stored.token_hash).not.toBe(token);
    expect(stored.token_hash).toMatch(/^[0-9a-f]{64}$/);

    const info = await t.request().get(`/api/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body.invitation).toEqual({ boardTitle: 'Mux logic unit', email: 'calder@room14.example', role: 'viewer', invitedBy: 'Theo Vance' });

    // accepting needs an account
    expect((await t.request().post(`/api/invitations/${token}/accept`)).status).toBe(401);
    const calder = await t.signUp('Ruth Calder', 'calder@room14.example');
    const accepted = await calder.post(`/api/invitations/${token}/accept`);
    expect(accepted.status).toBe(200);
    expect(accepted.body.board).toMatchObject({ id: boardId, title: 'Mux logic unit', role: 'viewer' });
    expect((await calder.get(`/api/boards/${boardId}`)).status).toBe(200);

    // single use
    expect((await t.request().get(`/api/invitations/${token}`)).status).toBe(404);
    const reuse = await calder.post(`/api/invitations/${token}/accept`);
    expect(reuse.status).toBe(404);
    expect(reuse.body.error.code).toBe('invitation_not_found');
    const members = await owner.get(`/api/boards/${boardId}/members`);
    expect(members.body.invitations).toEqual([]);
  });

  it('lets the owner change a role and remove a member', async () => {
    const calderId = (await t.ctx.db('users').where({ email: 'calder@room14.example' }).first()).id;
    const up = await owner.patch(`/api/boards/${boardId}/members/${calderId}`).send({ role: 'editor' });
    expect(up.status).toBe(200);
    expect(up.body.member).toMatchObject({ userId: calderId, role: 'editor' });
    expect((await owner.delete(`/api/boards/${boardId}/members/${calderId}`)).status).toBe(204);
    const gone = await owner.delete(`/api/boards/${boardId}/members/${calderId}`);
    expect(gone.status).toBe(404);
  });

  it('lets the owner withdraw an invitation', async () => {
    const inv = (await owner.post(`/api/boards/${boardId}/members`).send({ email: 'priya@room14.example', role: 'viewer' })).body.invitation;
    const mail = await t.waitForMail('priya@room14.example', /invited you/);
    expect((await owner.delete(`/api/boards/${boardId}/invitations/${inv.id}`)).status).toBe(204);
    expect((await t.request().get(`/api/invitations/${tokenFromMail(mail, 'invitations')}`)).status).toBe(404);
  });

  it('keeps the outbox to site admins', async () => {
    expect((await t.request().get('/api/admin/outbox')).status).toBe(401);
    const res = await owner.get('/api/admin/outbox');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('admin_only');
    expect((await admin.get('/api/admin/outbox/999999')).status).toBe(404);
  });

  it('answers 404 for an unknown invitation token, short or long', async () => {
    for (const token of ['x', 'y'.repeat(43)]) {
      const res = await t.request().get(`/api/invitations/${token}`);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('invitation_not_found');
    }
  });
});
