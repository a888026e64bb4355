import type { FormOptions, GenericObject, TypedSchema } from 'vee-validate'
import { reactive, toRefs } from 'vue'
import type { FieldSpec } from '~/utils/authFields'
import { useSchemaForm } from './useSchemaForm'

/**
 * A signed-out page's form, declared once: the schema and fields, the button's words and what a
 * valid submit sends. `form` is what AuthFormFrame takes (`v-bind="form"`).
 */
export function useAuthForm<In extends GenericObject, Out extends GenericObject>(spec: {
  schema: TypedSchema<In, Out>
  fields: FieldSpec[]
  submitLabel: string
  busyLabel: string
  initialValues?: FormOptions<In, Out>['initialValues']
  send: (values: Out) => Promise<unknown>
}) {
  const { form, attempt } = useSchemaForm(spec.schema, spec.send, spec.initialValues)
  return { form: reactive({ ...toRefs(form), fields: spec.fields, submitLabel: spec.submitLabel, busyLabel: spec.busyLabel }), attempt }
}
