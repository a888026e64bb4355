// Worker-thread entry (built to <output>/server/workers/bar-model.mjs, see
// server/workers/entries.ts): cut plans and blank grades off the thread that answers requests.
import { runBarModelTask, type BarModelReply, type BarModelTask } from '../../shared/barModel/runBarModelTask'
import { lowerThreadPriority } from './lowerThreadPriority'

lowerThreadPriority()

export default function run(task: BarModelTask): BarModelReply {
  return runBarModelTask(task)
}
