import { useNavigate, useParams } from 'react-router';
import { paths } from '../../../config/paths';
import { useCreateProcedure, useProcedure, useUpdateProcedure } from '../api';
import { BackLink, PageHeader, QueryState } from '../components/page-parts';
import { ProcedureForm } from '../components/procedure-form';
import { emptyProcedure, procedureToFormValues } from '../components/procedure-form-values';

export function ProcedureCreatePage() {
  const navigate = useNavigate();
  const create = useCreateProcedure();
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.procedures}>All procedures</BackLink>
      <PageHeader title="New procedure">
        Write the lines at base scale (one bench), then the steps. The calculation under the lines
        follows what you type.
      </PageHeader>
      <ProcedureForm
        defaultValues={emptyProcedure}
        submitLabel="Save procedure"
        onCancel={() => navigate(paths.procedures)}
        onSubmit={async (body) => {
          const saved = await create.mutateAsync(body);
          navigate(paths.procedure(saved.id));
        }}
      />
    </div>
  );
}

export function ProcedureEditPage() {
  const id = Number(useParams().id);
  const navigate = useNavigate();
  const procedure = useProcedure(id);
  const update = useUpdateProcedure(id);
  return (
    <QueryState query={procedure} what="procedure">
      {(data) => (
        <div className="flex flex-col gap-5">
          <BackLink to={paths.procedure(id)}>{data.title}</BackLink>
          <PageHeader title={`Edit: ${data.title}`}>
            Saving replaces every line and step. Runs already recorded keep what they used.
          </PageHeader>
          <ProcedureForm
            defaultValues={procedureToFormValues(data)}
            submitLabel="Save changes"
            onCancel={() => navigate(paths.procedure(id))}
            onSubmit={async (body) => {
              await update.mutateAsync(body);
              navigate(paths.procedure(id));
            }}
          />
        </div>
      )}
    </QueryState>
  );
}
