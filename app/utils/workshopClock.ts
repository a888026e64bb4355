import { formatZonedDate, formatZonedDateTime, UTC_CLOCK, type WorkshopClock } from '#shared/format/dates'
import { formatTemperature } from '#shared/format/temperature'
import type { TemperatureUnit } from '#shared/records/lists'

/**
 * The signed-in workshop's clock (its time zone and date locale, carried by the session), or
 * UTC outside a workshop. Read during a component's render, on the server and in the browser
 * alike, so both write the same time.
 */
export function workshopClock(): WorkshopClock {
  let clock: WorkshopClock = UTC_CLOCK
  tryUseNuxtApp()?.runWithContext(() => {
    const settings = useAuth().data.value?.settings
    if (settings) clock = { timeZone: settings.timeZone, locale: settings.locale }
  })
  return clock
}

/** An instant in the workshop's time zone and locale ("29 Mar 2026, 03:30 CEST"). */
export function formatWhen(value: string | Date | null | undefined): string {
  return formatZonedDateTime(value, workshopClock())
}

/** A calendar day in the workshop's time zone and locale ("30 Mar 2026"). */
export function formatDay(value: string | Date | null | undefined): string {
  return formatZonedDate(value, workshopClock())
}

/** A bench temperature (stored in °C) in the workshop's unit. */
export function formatBenchTemperature(celsius: number | null | undefined): string {
  let unit: TemperatureUnit = 'C'
  tryUseNuxtApp()?.runWithContext(() => {
    unit = useAuth().data.value?.settings?.temperatureUnit ?? 'C'
  })
  return formatTemperature(celsius, unit)
}
