import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Form } from '../../../components/ui/form';
import { SelectField, SubmitButton, TextField } from '../../../components/ui/form-fields';
import { PASSWORD_HINT, ROLES } from '@contract';
import { roleLabels } from '../../../config/roles';
import { isApiError, onField } from '../../../lib/api-error';
import { useCreateUser } from '../api/create-user';
import { createUserSchema, type CreateUserInput } from '../schemas';

const roleOptions = ROLES.map((r) => ({ value: r, label: roleLabels[r] }));
const empty: CreateUserInput = { name: '', email: '', role: 'salesperson', password: '' };

export function CreateUserForm() {
  const createUser = useCreateUser();
  const [created, setCreated] = useState<string | null>(null);

  return (
    <div className="flex flex-col gap-4">
      {created ? (
        <Alert tone="ok" title={`${created} can now sign in.`}>
          Give them their e-mail and the password you chose; they can use Gaugeline straight away.
        </Alert>
      ) : null}
      <Form
        schema={createUserSchema}
        defaultValues={empty}
        resetOnSuccess
        aria-label="Add a user"
        onSubmit={async (values) => {
          setCreated(null);
          try {
            const user = await createUser.mutateAsync(values);
            setCreated(user.name);
          } catch (e) {
            // A taken e-mail comes back as a 409 without field paths: show it under the E-mail field.
            throw isApiError(e) && e.status === 409 ? onField(e, 'email') : e;
          }
        }}
      >
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField name="name" label="Name" autoComplete="off" />
          <TextField name="email" label="E-mail" type="email" inputMode="email" autoComplete="off" />
          <SelectField name="role" label="Role" options={roleOptions} />
          <TextField
            name="password"
            label="First password"
            type="password"
            autoComplete="new-password"
            hint={PASSWORD_HINT}
          />
        </div>
        <div>
          <SubmitButton>Add user</SubmitButton>
        </div>
      </Form>
    </div>
  );
}
