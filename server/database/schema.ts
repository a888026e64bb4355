// The Drizzle schema, one file per part of the product; drizzle-kit and the app read it from here.
export * from './schema/accounts'
export * from './schema/records'
export * from './schema/strikes'
export * from './schema/certificates'
export * from './schema/cutPlans'
export * from './schema/blanks'
export * from './schema/service'
export * from './schema/calibrations'
