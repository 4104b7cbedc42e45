import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import type { AddressObject } from 'mailparser'

// The development SMTP catcher: runs only when no real relay is configured, on 127.0.0.1. It keeps the account links'
// tokens out of what it stores (an admin reading the mailbox could otherwise set anyone's password), unless
// NUXT_MAILBOX_LINKS=1 (the demo and the tests, where the mailbox stands in for everyone's inbox).
export default defineNitroPlugin((nitroApp) => {
  if (!usingFakeSmtp()) return
  const port = Number(useRuntimeConfig().fakeSmtp.port)
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: 25 * 1024 * 1024,
    onData(stream, _session, callback) {
      simpleParser(stream).then((mail) => {
        const addresses = (a: AddressObject | AddressObject[] | undefined) =>
          (Array.isArray(a) ? a : a ? [a] : []).map(x => x.text).join(', ')
        const stored = (t: string) => (serverConfig().mailboxLinks ? t : withoutAccountTokens(t))
        useDB().insert(schema.caughtMail).values({
          from: addresses(mail.from),
          to: addresses(mail.to),
          subject: mail.subject ?? '',
          text: stored(mail.text ?? ''),
          html: typeof mail.html === 'string' ? stored(mail.html) : null,
          attachments: mail.attachments.map(a => ({ filename: a.filename ?? 'attachment', contentType: a.contentType, size: a.size })),
        }).run()
        callback()
      }, (err: Error) => callback(err))
    },
  })
  server.on('error', err => console.error('[fake-smtp]', err.message))
  server.listen(port, '127.0.0.1')
  nitroApp.hooks.hook('close', () => new Promise<void>(resolve => server.close(() => resolve())))
})
