/**
 * A mail worker that dies mid-send, for the claim-timeout fault test: it queues one
 * message (with a job id, so the app's sweep leaves it alone while the claim holds),
 * then delivers it with the app's own code to an SMTP server that never answers.
 * The test kills this process with SIGKILL while it waits.
 *
 *   node --import tsx tests/integration/support/doomed-mail-worker.ts TO SMTP_PORT LEASE_S
 */
import { tmpdir } from 'node:os'
import { createDatabase } from '../../../server/database/client'
import { mailMessages } from '../../../server/database/schema'
import { deliverMessage } from '../../../server/utils/mail'
import { fileStorage } from '../../../server/utils/storage-fs'

const [to, smtpPort, leaseS] = process.argv.slice(2)
const { db } = createDatabase(process.env.NUXT_DATABASE_URL!, { max: 2 })
const [row] = await db.insert(mailMessages).values({
  kind: 'password-reset', to: to!, subject: 'Claim-timeout fault test', text: 'Delivered once after the worker died.', html: '<p>Delivered once after the worker died.</p>',
  status: 'queued', jobId: 'doomed-worker',
}).returning({ id: mailMessages.id })
process.stdout.write(`${row!.id}\n`)
await deliverMessage(db, fileStorage(tmpdir()), { host: '127.0.0.1', port: Number(smtpPort), user: '', pass: '', from: 'Tonewright <certificates@tonewright.test>' }, row!.id, false, { workerId: `doomed:${process.pid}`, leaseS: Number(leaseS) })
process.stdout.write('the send ended before the test killed this worker\n')
process.exit(3)
