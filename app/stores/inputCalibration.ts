import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import type { CalibrationList } from '#shared/schemas/calibrations'

const KEY = 'tonewright.inputCalibration'

/**
 * The input device this browser records with, remembered in localStorage, and the
 * workshop's calibrations: the Bench sends the device's newest calibration with every
 * strike, so a new reference tone takes over without choosing again.
 */
export const useInputCalibrationStore = defineStore('inputCalibration', () => {
  const device = ref<string | null>(null)
  const list = ref<CalibrationList | null>(null)
  let restored = false

  function restore() {
    if (restored || typeof localStorage === 'undefined') return
    restored = true
    const saved = localStorage.getItem(KEY)
    if (saved) device.value = saved
  }
  watch(device, (value) => {
    if (typeof localStorage === 'undefined') return
    if (value) localStorage.setItem(KEY, value)
    else localStorage.removeItem(KEY)
  })

  const devices = computed(() => list.value?.devices.map(d => d.device) ?? [])
  /** The chosen device's current calibration; null when none is chosen or it has none. */
  const current = computed(() => list.value?.devices.find(d => d.device === device.value)?.current ?? null)
  const calibrationId = computed(() => current.value?.id ?? null)

  return { device, list, devices, current, calibrationId, restore }
})
