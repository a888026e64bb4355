/** GET /api/dev/mailbox: development only; the messages the local SMTP catcher received. */
export default defineEventHandler(async (event) => {
  const dir = requireDevMailbox()
  await requireMember(event, 'workshop:read')
  return listCaughtMail(dir)
})
