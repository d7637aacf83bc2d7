import { Link, useNavigate } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import { paths } from '../../../config/paths';
import { useCreateChemical } from '../api';
import { ChemicalForm, emptyChemical } from '../components/chemical-form';

export function ChemicalCreatePage() {
  const create = useCreateChemical();
  const navigate = useNavigate();

  return (
    <div className="flex max-w-5xl flex-col gap-4">
      <Link
        to={paths.chemicals}
        className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        All chemicals
      </Link>
      <h1 className="text-xl font-semibold text-ink-900">Add a chemical</h1>
      <ChemicalForm
        mode="create"
        defaultValues={emptyChemical}
        submitLabel="Add chemical"
        onCancel={() => navigate(paths.chemicals)}
        onSubmit={async (values) => {
          const chemical = await create.mutateAsync(values);
          navigate(paths.chemical(chemical.id), { replace: true });
        }}
      />
    </div>
  );
}
