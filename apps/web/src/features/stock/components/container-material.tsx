import { useState } from 'react';
import {
  containerMaterialLabels,
  containerMaterials,
  type ContainerDetail,
  type ContainerMaterial,
} from '@lotwise/shared';
import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/input';
import { errorMessage } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { useUpdateContainer } from '../api';

/**
 * What a container is made of (the container-size limits depend on it): shown to everyone,
 * changed in place by roles with `stock.write`.
 */
export function ContainerMaterialField({ container }: { container: ContainerDetail }) {
  const mayWrite = useCan('stock.write');
  const update = useUpdateContainer(container.id);
  const [choice, setChoice] = useState<string>(container.material ?? '');
  const current = container.material ? containerMaterialLabels[container.material] : 'Not said';
  if (!mayWrite) return <span>{current}</span>;
  const changed = choice !== (container.material ?? '');
  return (
    <span className="flex flex-col gap-1">
      <span className="flex flex-wrap items-center gap-2">
        <Select
          aria-label="Material"
          className="w-44"
          value={choice}
          onChange={(e) => setChoice(e.target.value)}
        >
          <option value="">Not said</option>
          {containerMaterials.map((m) => (
            <option key={m} value={m}>
              {containerMaterialLabels[m]}
            </option>
          ))}
        </Select>
        {changed && (
          <Button
            size="sm"
            busy={update.isPending}
            onClick={() =>
              update.mutate({ material: (choice || null) as ContainerMaterial | null })
            }
          >
            Save material
          </Button>
        )}
      </span>
      {update.isError && (
        <span role="alert" className="text-sm text-danger-700">
          {errorMessage(update.error)} The material was not changed.
        </span>
      )}
    </span>
  );
}
