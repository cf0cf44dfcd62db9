/**
 * The development mailbox shows every e-mail the server sent (password links, tracking links),
 * so it is served only to this machine, by a development server listening on loopback with no
 * proxy in front. Each refusal is tested on its own, first as the pure rule, then through the
 * app.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createApp, type AppDeps } from '../../server/app'
import { createTestContext, type TestContext } from '../support/harness'
import { isLoopbackAddress, isLoopbackHost, mailboxAccess, mailboxSetting, type MailboxSetting } from '../../server/modules/dev/mailbox-guard'

const ON: MailboxSetting = { dir: '/some/mailbox', nodeEnv: 'development', listenHost: '127.0.0.1', trustProxy: 0 }
const LOCAL = { remoteAddress: '127.0.0.1', forwarded: false }

describe('the mailbox rule', () => {
  it('serves a loopback request when every condition holds', () => {
    expect(mailboxAccess(ON, LOCAL)).toEqual({ on: true })
    expect(mailboxAccess({ ...ON, nodeEnv: 'test', listenHost: '::1' }, { remoteAddress: '::ffff:127.0.0.1', forwarded: false })).toEqual({ on: true })
  })

  it.each([
    ['DEV_MAILBOX_DIR is not set', { ...ON, dir: undefined }, 'no_mailbox_dir'],
    ['DEV_MAILBOX_DIR is empty', { ...ON, dir: '' }, 'no_mailbox_dir'],
    ['NODE_ENV is production', { ...ON, nodeEnv: 'production' }, 'production'],
    ['the server listens on every interface (0.0.0.0)', { ...ON, listenHost: '0.0.0.0' }, 'not_loopback_listener'],
    ['the server listens on every interface (::)', { ...ON, listenHost: '::' }, 'not_loopback_listener'],
    ['the server listens on a network address', { ...ON, listenHost: '192.0.2.10' }, 'not_loopback_listener'],
    ['the listen host is unknown', { ...ON, listenHost: undefined }, 'not_loopback_listener'],
    ['a proxy is declared in front (TRUST_PROXY)', { ...ON, trustProxy: 1 }, 'behind_proxy'],
  ] as const)('is off when %s, even for a loopback request', (_what, setting, reason) => {
    expect(mailboxSetting(setting)).toEqual({ on: false, reason })
    expect(mailboxAccess(setting, LOCAL)).toEqual({ on: false, reason })
  })

  it.each([
    ['from another machine', { remoteAddress: '192.0.2.7', forwarded: false }, 'remote_client'],
    ['over IPv6 from another machine', { remoteAddress: 'fd00::7', forwarded: false }, 'remote_client'],
    ['whose address is unknown', { remoteAddress: undefined, forwarded: false }, 'remote_client'],
    ['through a proxy on this machine (a forwarding header)', { remoteAddress: '127.0.0.1', forwarded: true }, 'forwarded_request'],
  ] as const)('refuses a request %s', (_what, req, reason) => {
    expect(mailboxAccess(ON, req)).toEqual({ on: false, reason })
  })

  it('knows loopback addresses and hosts from look-alikes', () => {
    expect(['127.0.0.1', '127.8.9.10', '::1', '::ffff:127.0.0.1', '[::1]'].map(isLoopbackAddress)).toEqual([true, true, true, true, true])
    expect(['128.0.0.1', '10.127.0.1', '127.0.0.1.example', '127.0.0.256', '::2', '', undefined].map(isLoopbackAddress)).toEqual([false, false, false, false, false, false, false])
    expect(['localhost', '127.0.0.1', '::1'].map(isLoopbackHost)).toEqual([true, true, true])
    expect(['0.0.0.0', '::', 'quietband.example', 'localhost.example'].map(isLoopbackHost)).toEqual([false, false, false, false])
  })
})

describe('GET /api/dev/mailbox', () => {
  let t: TestContext
  const mailboxDir = fs.mkdtempSync(path.join(os.tmpdir(), 'qb-mailbox-test-'))
  const closers: (() => void)[] = []
  beforeAll(async () => {
    t = await createTestContext()
    fs.writeFileSync(
      path.join(mailboxDir, '0001.json'),
      JSON.stringify({ id: '0001', from: 'no-reply@quietband.test', to: ['someone@example.test'], subject: 'Reset your Quietband password', date: new Date(0).toISOString(), text: 'a link' }),
    )
  })
  afterAll(async () => {
    for (const close of closers) close()
    await t.close()
    fs.rmSync(mailboxDir, { recursive: true, force: true })
  })

  /** An app as `npm start` makes it (loopback, development, no proxy), with the given changes. */
  function appWith(changes: Partial<AppDeps>) {
    const handle = createApp({
      pool: t.pool,
      boss: t.boss,
      sessionSecret: 'test-session-secret-that-is-long-enough-0123',
      publicUrl: 'http://127.0.0.1:3999',
      mailboxDir,
      listenHost: '127.0.0.1',
      nodeEnv: 'development',
      trustProxy: 0,
      ...changes,
    })
    closers.push(() => handle.close())
    return handle.app
  }

  async function refused(res: request.Response) {
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('mailbox_disabled')
    expect(res.body.error.message).toContain('served only when DEV_MAILBOX_DIR is set')
    expect(JSON.stringify(res.body)).not.toContain('Reset your Quietband password')
    return res.body.error.message as string
  }

  it('lists the messages to a browser on this machine of a loopback development server', async () => {
    const res = await request(appWith({})).get('/api/dev/mailbox').expect(200)
    expect(res.body.messages.map((m: { subject: string }) => m.subject)).toEqual(['Reset your Quietband password'])
  })

  it('is off without DEV_MAILBOX_DIR', async () => {
    expect(await refused(await request(appWith({ mailboxDir: undefined })).get('/api/dev/mailbox'))).toContain('DEV_MAILBOX_DIR is not set')
  })

  it('is off under NODE_ENV=production', async () => {
    expect(await refused(await request(appWith({ nodeEnv: 'production' })).get('/api/dev/mailbox'))).toContain('NODE_ENV is production')
  })

  it('is off when the server listens on every interface', async () => {
    expect(await refused(await request(appWith({ listenHost: '0.0.0.0' })).get('/api/dev/mailbox'))).toContain('does not listen on a loopback address')
  })

  it('is off when nobody said where the server listens', async () => {
    await refused(await request(appWith({ listenHost: undefined })).get('/api/dev/mailbox'))
  })

  it('is off behind a declared proxy, even when X-Forwarded-For claims loopback', async () => {
    const res = await request(appWith({ trustProxy: 1 })).get('/api/dev/mailbox').set('X-Forwarded-For', '127.0.0.1')
    expect(await refused(res)).toContain('TRUST_PROXY')
  })

  it('refuses a request that came through a proxy on this machine', async () => {
    expect(await refused(await request(appWith({})).get('/api/dev/mailbox').set('X-Forwarded-For', '127.0.0.1'))).toContain('through a proxy')
    await refused(await request(appWith({})).get('/api/dev/mailbox').set('Forwarded', 'for=127.0.0.1'))
  })

  const outward = Object.values(os.networkInterfaces())
    .flat()
    .find((i) => i && i.family === 'IPv4' && !i.internal)
  // needs a network interface besides loopback to connect from; the rule above covers it regardless
  it.skipIf(!outward)('refuses a connection from another address than loopback, whatever the headers say', async () => {
    const app = appWith({})
    const server: Server = await new Promise((resolve) => {
      const s = app.listen(0, outward!.address, () => resolve(s))
    })
    closers.unshift(() => server.close())
    const { port } = server.address() as AddressInfo
    const res = await request(`http://${outward!.address}:${port}`).get('/api/dev/mailbox')
    expect(await refused(res)).toContain('does not come from this machine')
  })
})
