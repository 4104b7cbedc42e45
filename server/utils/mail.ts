import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'

let transporter: Transporter | undefined

/** True when no relay is configured: mail goes to the local catcher and never leaves the machine. */
export function usingFakeSmtp(): boolean {
  return !useRuntimeConfig().smtp.host
}

function transport(): Transporter {
  if (transporter) return transporter
  const { smtp, fakeSmtp } = useRuntimeConfig()
  transporter = usingFakeSmtp()
    ? nodemailer.createTransport({ host: '127.0.0.1', port: Number(fakeSmtp.port), secure: false, ignoreTLS: true })
    : nodemailer.createTransport({
        host: smtp.host, port: Number(smtp.port), secure: Boolean(smtp.secure),
        auth: smtp.user ? { user: smtp.user, pass: smtp.pass } : undefined,
      })
  return transporter
}

export interface OutgoingMail {
  to: string | string[]
  subject: string
  text: string
  html?: string
  attachments?: Array<{ filename: string; content: Buffer; contentType: string }>
}

/** Sends one message through the configured SMTP relay (or the local catcher). */
export async function sendMail(mail: OutgoingMail): Promise<void> {
  await transport().sendMail({ from: useRuntimeConfig().smtp.from, ...mail })
}

/**
 * Sends a message after the response has gone (errors are logged, once a minute at most): for requests whose answer
 * must not depend on whether a mail went out, such as a password-reset request (its timing would tell which
 * addresses have accounts).
 */
export function queueMail(mail: OutgoingMail): void {
  setImmediate(() => {
    sendMail(mail).catch(err => logThrottled('mail:queued', '[mail] a queued message could not be sent (repeats are logged once a minute):', err))
  })
}

/** Absolute link into the app for e-mails. */
export function appLink(path: string): string {
  return new URL(path, serverConfig().appUrl).toString()
}
