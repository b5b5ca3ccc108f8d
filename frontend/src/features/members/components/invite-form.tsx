import { CAMPAIGN_ROLES, inviteMemberRequestSchema } from '@contracts/campaigns';
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { ErrorNotice, Notice } from '@/components/ui/notice';
import { useInviteMember } from '../api/invite-member';

type Values = z.input<typeof inviteMemberRequestSchema>;

const ROLE_HINT = 'A lead manages the campaign, a reader reads assigned spectra, an observer only looks.';

export function InviteForm({ campaignId }: { campaignId: number }) {
  const invite = useInviteMember(campaignId);
  const { register, handleSubmit, formState, reset } = useForm<Values, unknown, z.output<typeof inviteMemberRequestSchema>>({
    resolver: zodResolver(inviteMemberRequestSchema),
    defaultValues: { email: '', role: 'reader' },
  });

  const onSubmit = handleSubmit((values) =>
    invite.mutate(values, { onSuccess: () => reset({ email: '', role: values.role }) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
      <ErrorNotice error={invite.error} />
      {invite.isSuccess ? (
        <Notice tone="success" role="status">
          Invitation sent to {invite.data.email}.
        </Notice>
      ) : null}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[1fr_16rem]">
        <TextField label="Invitee e-mail" type="email" autoComplete="off" error={formState.errors.email?.message} {...register('email')} />
        <SelectField label="Role" hint={ROLE_HINT} error={formState.errors.role?.message} {...register('role')}>
          {/* Option text is the role's own word, as used across the product and in e-mails. */}
          {CAMPAIGN_ROLES.map((role) => (
            <option key={role} value={role}>
              {role}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button type="submit" pending={invite.isPending} pendingLabel="Sending…">
          Send invitation
        </Button>
      </div>
    </form>
  );
}
