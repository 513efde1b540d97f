import type { Database } from '@db/client'
import type { VehiclePage } from '@shared/schemas/vehicle-page'
import { summarizeVehicles } from '../charges/index'
import { filesOf } from '../files/index'
import { versionsById } from '../rule-sets/index'
import { classesOfVersion } from './rules'
import { historyEvents, holdsOf, nameOf, propertyOf, spaceOf, towOf, versionNumber } from './vehicle-page.queries'
import { vehicleForUser } from './vehicles.queries'
import { ruleSetTitle } from '@shared/messages/rule-words'

/** Everything recorded about one vehicle, with its running bill and next legal date as of now. */
export async function vehiclePage(db: Database, userId: string, vehicleId: string, asOf = new Date()): Promise<VehiclePage> {
  const { vehicle: v, yard } = await vehicleForUser(db, userId, vehicleId)
  const classes = await classesOfVersion(db, v.ruleSetVersionId)
  const ruleSet = v.ruleSetVersionId ? (await versionsById(db, [v.ruleSetVersionId])).get(v.ruleSetVersionId) : undefined
  const problems = new Map<string, string>()
  const summaries = await summarizeVehicles(db, yard, [v], asOf, problems)
  return {
    vehicle: {
      id: v.id,
      stockNumber: v.stockNumber,
      state: v.state,
      disposition: v.disposition,
      version: v.version,
      arrivedAt: v.arrivedAt.toISOString(),
      closedAt: v.closedAt?.toISOString() ?? null,
      vin: v.vin,
      vinOverrideReason: v.vinOverrideReason,
      plate: v.plate,
      plateState: v.plateState,
      year: v.year,
      make: v.make,
      model: v.model,
      colour: v.colour,
      body: v.body,
      vehicleClass: v.vehicleClass,
      vehicleClassLabel: classes.find((c) => c.code === v.vehicleClass)?.label ?? v.vehicleClass,
      ...classWords(classes.find((c) => c.code === v.vehicleClass)?.es?.label),
      odometer: v.odometer,
      odometerUnreadable: v.odometerUnreadable,
      keys: v.keys,
      keysWhere: v.keysWhere,
      drivableAsFound: v.drivableAsFound,
      ownerName: v.ownerName,
      estimatedValueCents: v.estimatedValueCents,
      estimatedValueSource: v.estimatedValueSource,
      rolls: v.rolls,
      steers: v.steers,
      brakes: v.brakes,
      conditionNotes: v.conditionNotes,
      checkedBy: await nameOf(db, v.checkedById),
      space: await spaceOf(db, v.spaceId),
    },
    tow: await towOf(db, v.id),
    yard: { name: yard.name, code: yard.code, timeZone: yard.timeZone, lat: yard.lat, lng: yard.lng },
    ruleSet: ruleSet ? { ...ruleSetTitle(ruleSet), version: (await versionNumber(db, v.ruleSetVersionId)) ?? 1 } : null,
    holds: await holdsOf(db, v.id),
    files: await filesOf(db, v.id),
    property: await propertyOf(db, v.id),
    history: await historyEvents(db, v.id),
    summary: summaries.get(v.id) ?? null,
    billProblem: problems.get(v.id) ?? null,
  }
}

/** The class's Spanish label beside the English, where the rule set has it. */
function classWords(label: string | undefined) {
  return label ? { es: { vehicleClassLabel: label } } : {}
}
