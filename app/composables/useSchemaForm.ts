import { useForm, type FormOptions, type GenericObject, type TypedSchema } from 'vee-validate'
import { reactive } from 'vue'
import { useProblem } from './useProblem'

/**
 * A form checked by a schema that sends one request when valid: `form` holds the problem sentence,
 * `busy` and `onSubmit` (bind it on the form's frame); `attempt` runs another request against the
 * same sentence; `values` and `errors` are the form's own.
 */
export function useSchemaForm<In extends GenericObject, Out extends GenericObject>(
  schema: TypedSchema<In, Out>,
  send: (values: Out) => Promise<unknown>,
  initialValues?: FormOptions<In, Out>['initialValues'],
) {
  const { problem, attempt } = useProblem()
  const { handleSubmit, isSubmitting, values, errors } = useForm({ validationSchema: schema, initialValues })
  const form = reactive({ problem, busy: isSubmitting, onSubmit: handleSubmit(input => attempt(() => send(input))) })
  return { form, attempt, values, errors }
}
