import { Link, useNavigate, useParams } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useChemical, useUpdateChemical } from '../api';
import { ChemicalForm, chemicalToFormValues } from '../components/chemical-form';

export function ChemicalEditPage() {
  const params = useParams();
  const id = Number(params.id);
  const chemical = useChemical(id);
  const update = useUpdateChemical(id);
  const navigate = useNavigate();

  const back = (
    <Link
      to={paths.chemical(id)}
      className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
    >
      <ChevronLeft aria-hidden="true" className="size-4" />
      Back to the chemical
    </Link>
  );

  if (chemical.isPending) return <PageSpinner label="Loading the chemical…" />;
  if (chemical.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The chemical could not be loaded"
          error={chemical.error}
          onRetry={() => void chemical.refetch()}
        />
      </div>
    );
  }

  return (
    <div className="flex max-w-5xl flex-col gap-4">
      {back}
      <h1 className="text-xl font-semibold text-ink-900">Edit {chemical.data.name}</h1>
      <ChemicalForm
        // A fresh form per loaded record, so a refetch never overwrites what is being typed.
        key={chemical.data.id}
        mode="edit"
        defaultValues={chemicalToFormValues(chemical.data)}
        submitLabel="Save changes"
        onCancel={() => navigate(paths.chemical(id))}
        onSubmit={async (_values, changed) => {
          await update.mutateAsync(changed);
          navigate(paths.chemical(id), { replace: true });
        }}
      />
    </div>
  );
}
