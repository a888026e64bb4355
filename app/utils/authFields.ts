// The fields the signed-out pages ask for, written once (FormField's props).
export interface FieldSpec { name: string, label: string, type?: string, autocomplete?: string, hint?: string }

const NEW_PASSWORD_HINT = 'At least 10 characters.'

export const AUTH_FIELDS = {
  email: { name: 'email', label: 'E-mail', type: 'email', autocomplete: 'username' },
  currentPassword: { name: 'password', label: 'Password', type: 'password', autocomplete: 'current-password' },
  yourName: { name: 'name', label: 'Your name', autocomplete: 'name' },
  workshopName: { name: 'workshopName', label: 'Workshop name', autocomplete: 'organization' },
  newPassword: (name: string, label: string): FieldSpec => ({ name, label, type: 'password', autocomplete: 'new-password', hint: NEW_PASSWORD_HINT }),
} satisfies Record<string, FieldSpec | ((name: string, label: string) => FieldSpec)>
