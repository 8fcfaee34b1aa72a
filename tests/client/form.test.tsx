import { fireEvent, render, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { Form } from '../../client/src/components/ui/form';
import { NumberField, SubmitButton, TextField } from '../../client/src/components/ui/form-fields';
import { ApiError } from '../../client/src/lib/api-error';

const schema = z.object({
  name: z.string().min(1, { message: 'Enter a name.' }),
  email: z.string(),
  room: z.object({ width: z.number({ message: 'Enter the width in feet.' }) }),
});

function renderForm(onSubmit: (values: z.output<typeof schema>) => Promise<void>) {
  render(
    <Form
      schema={schema}
      defaultValues={{ name: 'Test Person', email: 'a@example.com', room: { width: 12 } }}
      onSubmit={onSubmit}
    >
      <TextField name="name" label="Name" />
      <TextField name="email" label="E-mail" />
      <NumberField name="room.width" label="Width" />
      <SubmitButton>Save</SubmitButton>
    </Form>,
  );
}

const validationError = (errors: { path: string; message: string }[]) =>
  new ApiError({
    status: 400,
    code: 'validation',
    title: 'Invalid request',
    detail: 'Some fields need attention.',
    errors,
  });

describe('Form', () => {
  it('maps 400 field errors from the server onto the matching fields, nested ones included', async () => {
    renderForm(async () => {
      throw validationError([
        { path: 'email', message: 'Enter a valid e-mail address.' },
        { path: 'room.width', message: 'Width must be more than 0.' },
      ]);
    });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));

    const email = await screen.findByLabelText('E-mail');
    await waitFor(() => expect(email).toHaveAttribute('aria-invalid', 'true'));
    expect(email).toHaveAccessibleDescription('Enter a valid e-mail address.');
    expect(screen.getByLabelText('Width')).toHaveAccessibleDescription('Width must be more than 0.');
    expect(screen.getByLabelText('Name')).not.toHaveAttribute('aria-invalid');
    expect(screen.getByRole('alert')).toHaveTextContent('Check the highlighted fields.');
  });

  it('lists errors for paths that are not fields, with the problem detail', async () => {
    renderForm(async () => {
      throw validationError([{ path: '(body)', message: 'Send at least one change.' }]);
    });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Some fields need attention.');
    expect(alert).toHaveTextContent('Send at least one change.');
  });

  it('shows a non-validation problem as the form message', async () => {
    renderForm(async () => {
      throw new ApiError({
        status: 409,
        code: 'conflict',
        title: 'Conflict',
        detail: 'That e-mail is already in use.',
      });
    });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('That e-mail is already in use.');
  });

  it('validates with the schema before submitting, and parses numbers', async () => {
    const onSubmit = vi.fn(async () => {});
    renderForm(onSubmit);
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: '' } });
    fireEvent.change(screen.getByLabelText('Width'), { target: { value: '' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect(await screen.findByText('Enter a name.')).toBeInTheDocument();
    expect(screen.getByText('Enter the width in feet.')).toBeInTheDocument();
    expect(onSubmit).not.toHaveBeenCalled();

    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Someone' } });
    fireEvent.change(screen.getByLabelText('Width'), { target: { value: '14.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    await waitFor(() =>
      expect(onSubmit).toHaveBeenCalledWith(
        { name: 'Someone', email: 'a@example.com', room: { width: 14.5 } },
        expect.anything(),
      ),
    );
    expect(screen.getByLabelText('Width')).toHaveAttribute('inputmode', 'decimal');
  });
});
