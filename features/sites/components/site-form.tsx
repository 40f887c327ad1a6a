'use client';

import { toast } from 'sonner';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { Dialog, DialogActions } from '@/components/ui/dialog';
import { TextField } from '@/components/ui/field';
import { FormAlert } from '@/components/ui/form-alert';
import type { SiteSummary } from '@/lib/sites/types';
import { useServerForm } from '@/lib/forms/use-server-form';
import { siteInputSchema, type SiteInput } from '@/lib/sites/schemas';

import { useCreateSite, useUpdateSite } from '../api/use-site-mutations';

type SiteFormValues = z.input<typeof siteInputSchema>;

const FIELDS = ['name', 'client', 'address'] as const;

type SiteFormDialogProps = {
  open: boolean;
  onClose: () => void;
  /** The site to edit; a new site when absent. */
  site?: SiteSummary | null;
  onSaved?: (site: SiteSummary) => void;
};

/** Creates a site, or renames one and edits its client and address. */
export function SiteFormDialog({ open, onClose, site, onSaved }: SiteFormDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title={site ? 'Edit site' : 'New site'}
      description={site ? undefined : 'A site holds the boards of one building or installation.'}
    >
      <SiteForm site={site ?? null} onClose={onClose} onSaved={onSaved} />
    </Dialog>
  );
}

function SiteForm({
  site,
  onClose,
  onSaved,
}: {
  site: SiteSummary | null;
  onClose: () => void;
  onSaved?: (site: SiteSummary) => void;
}) {
  const create = useCreateSite();
  const update = useUpdateSite();
  const {
    register,
    formError,
    onSubmit,
    formState: { errors, isSubmitting },
  } = useServerForm<SiteFormValues, SiteInput>({
    schema: siteInputSchema,
    defaultValues: {
      name: site?.name ?? '',
      client: site?.client ?? '',
      address: site?.address ?? '',
    },
    // Field issues go beside their fields; anything else above the buttons
    fields: FIELDS,
    submit: async (input) => {
      // Send the whole form: a new site, or the edited one
      const saved = site ? await update.mutateAsync({ siteId: site.id, input }) : await create.mutateAsync(input);
      toast.success(site ? `Saved ${saved.name}.` : `Created ${saved.name}.`);
      onSaved?.(saved);
      onClose();
    },
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <TextField label="Site name" error={errors.name?.message} {...register('name')} />
      <TextField label="Client" hint="Optional" error={errors.client?.message} {...register('client')} />
      <TextField label="Address" hint="Optional" error={errors.address?.message} {...register('address')} />
      {formError ? <FormAlert>{formError}</FormAlert> : null}
      <DialogActions>
        <Button variant="secondary" onClick={onClose} disabled={isSubmitting}>
          Cancel
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : site ? 'Save site' : 'Create site'}
        </Button>
      </DialogActions>
    </form>
  );
}
