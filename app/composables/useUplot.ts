import type uPlot from 'uplot'
import 'uplot/dist/uPlot.min.css'

/**
 * One uPlot chart in `el`, rebuilt when `build` changes and resized with its box.
 * uPlot draws on a canvas, so tens of thousands of points stay smooth.
 */
export function useUplot(el: Ref<HTMLElement | null>, build: () => { options: Omit<uPlot.Options, 'width'>, data: uPlot.AlignedData } | null) {
  let chart: uPlot | null = null
  let observer: ResizeObserver | null = null

  async function render() {
    chart?.destroy()
    chart = null
    const spec = build()
    if (!el.value || !spec) return
    observer?.disconnect()
    observer?.observe(el.value)
    const { default: UPlot } = await import('uplot')
    if (!el.value) return
    chart = new UPlot({ ...spec.options, width: Math.max(200, el.value.clientWidth) }, spec.data, el.value)
  }

  onMounted(() => {
    observer = new ResizeObserver(() => {
      if (chart && el.value && Math.abs(chart.width - el.value.clientWidth) > 2) chart.setSize({ width: el.value.clientWidth, height: chart.height })
    })
    watchEffect(() => void render())
  })
  onBeforeUnmount(() => {
    observer?.disconnect()
    chart?.destroy()
  })
}
