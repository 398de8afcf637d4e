// Local SMTP fake for development and tests: accepts every message on loopback and keeps
// each one as a JSON file (envelope, headers, text and HTML) in the given folder.
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import { mkdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { parseArgs } from 'node:util'

const { values } = parseArgs({ options: { port: { type: 'string', default: '2525' }, dir: { type: 'string', default: '.data/mail' } } })
mkdirSync(values.dir, { recursive: true })
let count = 0

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream).then((mail) => {
      const record = {
        envelopeFrom: session.envelope.mailFrom && session.envelope.mailFrom.address,
        envelopeTo: session.envelope.rcptTo.map(r => r.address),
        messageId: mail.messageId,
        subject: mail.subject,
        from: mail.from && mail.from.text,
        to: mail.to && (Array.isArray(mail.to) ? mail.to.map(t => t.text).join(', ') : mail.to.text),
        headers: Object.fromEntries([...mail.headers].filter(([k]) => k.startsWith('x-')).map(([k, v]) => [k, String(v)])),
        text: mail.text,
        html: mail.html || null,
        receivedAt: new Date().toISOString(),
      }
      const name = `${Date.now()}-${process.pid}-${++count}.json`
      writeFileSync(join(values.dir, name), JSON.stringify(record, null, 2))
      callback()
    }, callback)
  },
})
server.on('error', err => console.error('smtp fake:', err.message))
server.listen(Number(values.port), '127.0.0.1', () => console.log(`smtp fake on 127.0.0.1:${values.port}, keeping mail in ${values.dir}`))
const stop = () => server.close(() => process.exit(0))
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
