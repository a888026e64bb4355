import { describeChanges, type FieldChange } from '../schemas/setEdit'

/** The parts of an audit event its sentence is made from. */
export interface AuditFacts {
  action: string
  fromState: string | null
  toState: string | null
  details: Record<string, unknown> | null
}

const text = (v: unknown) => (typeof v === 'string' || typeof v === 'number' ? String(v) : '')
const plural = (n: unknown, word: string) => `${text(n) || 'some'} ${word}${n === 1 ? '' : 's'}`

function changesOf(details: Record<string, unknown> | null): FieldChange[] {
  const list = details?.changes
  if (!Array.isArray(list)) return []
  return list.filter((c): c is FieldChange => typeof c === 'object' && c !== null && typeof (c as FieldChange).field === 'string')
}

const SENTENCES: Record<string, (e: AuditFacts) => string> = {
  'set.create': e => `entered the set with ${plural(e.details?.pieces, 'piece')}`,
  'set.edit': e => `changed ${describeChanges(changesOf(e.details)) || 'nothing'}`,
  'set.ship': () => 'marked the set shipped',
  'certificate.sign': e => `signed certificate ${text(e.details?.number)}${e.details?.supersedes ? `, superseding ${text(e.details.supersedes)}` : ''}`,
  'certificate.reissue': (e) => {
    const changes = describeChanges(changesOf(e.details))
    return `re-issued certificate ${text(e.details?.number)} as ${text(e.details?.supersededBy)}${changes ? ` (changed: ${changes})` : ''}`
  },
  'certificate.revoke': e => `revoked certificate ${text(e.details?.number)}`,
  'certificate.send': e => `queued certificate ${text(e.details?.number)} for e-mail to ${text(e.details?.to)}`,
  'piece.stage': e => `moved the piece from ${e.fromState ?? 'its stage'} to ${e.toState ?? 'another stage'}`,
  'piece.approve': e => `approved the piece${e.details?.override ? ' although its strike was not within' : ''}`,
  'piece.return': () => 'returned the piece for rework',
  'piece.reopen': () => 'reopened the piece',
  'piece.assign': e => (e.toState ? 'assigned the piece' : 'left the piece unassigned'),
  'piece.reanalyze': e => `re-measured ${plural(e.details?.strikes, 'strike')} with engine ${text(e.details?.engineVersion)}${e.fromState !== e.toState ? ` (verdict ${e.fromState ?? 'none'} → ${e.toState ?? 'none'})` : ''}`,
  'reanalysis.request': e => `asked for ${plural(e.details?.strikes, 'strike')} to be measured again`,
  'reanalysis.done': e => `finished measuring ${plural(e.details?.strikes, 'strike')} again (${text(e.details?.changed) || '0'} changed)`,
  'reanalysis.failed': () => 'could not finish measuring again',
}

/** What happened, in plain words, as the tail of "<who> …" (an action we have no sentence for reads as its name). */
export function auditSentence(event: AuditFacts): string {
  const sentence = SENTENCES[event.action]
  if (sentence) return sentence(event)
  const words = event.action.replace(/[._-]+/g, ' ')
  return event.toState ? `${words} (${event.fromState ? `${event.fromState} → ` : ''}${event.toState})` : words
}
