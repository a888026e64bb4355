import type { AnalysisResult } from '#shared/analysis/types'
import { useInputCalibrationStore } from '~/stores/inputCalibration'

/** The stored strike as `POST /api/pieces/:id/strikes` answers it. */
export interface RecordedStrike {
  id: string
  pieceId: string
  createdAt: string
  temperatureC: number | null
  humidityPct: number | null
  verdict: string | null
  analysis: AnalysisResult
}

export class UploadError extends Error {
  constructor(message: string, readonly status: number) {
    super(message)
  }
}

/**
 * Uploads one recording to a piece with XMLHttpRequest, for its upload progress
 * (fetch has none). Resolves with the stored strike; rejects with the server's
 * plain sentence (an engine refusal is 413/415/422, and nothing was saved).
 */
export function useStrikeUpload() {
  const { token } = useAuth()
  const calibration = useInputCalibrationStore()
  return function uploadStrike(
    pieceId: string,
    file: Blob,
    fileName: string,
    conditions: { temperatureC: number | null, humidityPct: number | null },
    onProgress?: (fraction: number) => void,
  ): Promise<RecordedStrike> {
    const form = new FormData()
    form.append('file', file, fileName)
    if (conditions.temperatureC !== null) form.append('temperatureC', String(conditions.temperatureC))
    if (conditions.humidityPct !== null) form.append('humidityPct', String(conditions.humidityPct))
    // The chosen input's calibration: the server corrects the frequencies and keeps its id with the strike.
    if (calibration.calibrationId) form.append('calibration-id', calibration.calibrationId)
    return new Promise((resolve, reject) => {
      const xhr = new XMLHttpRequest()
      xhr.open('POST', `/api/pieces/${encodeURIComponent(pieceId)}/strikes`)
      xhr.setRequestHeader('Accept', 'application/json')
      if (token.value) xhr.setRequestHeader('Authorization', token.value)
      xhr.responseType = 'json'
      xhr.upload.onprogress = (e) => {
        if (e.lengthComputable) onProgress?.(e.loaded / e.total)
      }
      xhr.onload = () => {
        if (xhr.status >= 200 && xhr.status < 300) {
          onProgress?.(1)
          // A 2xx answer is the stored strike (JSON, typed by the route).
          resolve(xhr.response as RecordedStrike)
        }
        else {
          const body = xhr.response as { message?: string } | null
          reject(new UploadError(body?.message ?? `The upload failed (${xhr.status}).`, xhr.status))
        }
      }
      xhr.onerror = () => reject(new UploadError('The server could not be reached. Check the connection and try again.', 0))
      xhr.send(form)
    })
  }
}

/** Decodes a recording in the browser, mixed to mono, at its own sample rate. */
export async function decodeForDisplay(bytes: ArrayBuffer, sampleRate: number): Promise<Float32Array> {
  const ctx = new OfflineAudioContext(1, 1, sampleRate)
  const buffer = await ctx.decodeAudioData(bytes)
  const out = new Float32Array(buffer.length)
  for (let c = 0; c < buffer.numberOfChannels; c++) {
    const ch = buffer.getChannelData(c)
    for (let i = 0; i < ch.length; i++) out[i]! += ch[i]! / buffer.numberOfChannels
  }
  return out
}
