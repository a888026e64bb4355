import { memberWithRole, newWorkshop } from './http'

/** A fresh workshop with its owner, a benchmaker (may strike) and an office member (may not), as tokens. */
export async function benchMembers(name: string): Promise<{ owner: string, benchmaker: string, office: string }> {
  const workshop = await newWorkshop(name)
  return {
    owner: workshop.token,
    benchmaker: (await memberWithRole(workshop.token, 'benchmaker')).token,
    office: (await memberWithRole(workshop.token, 'office')).token,
  }
}
