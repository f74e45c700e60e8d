import { useParams } from 'react-router-dom';
import { IdParamSchema } from '../../shared/api';

/** A numeric route parameter (`:id`), or null when the address holds something else. */
export function useIdParam(name = 'id'): number | null {
  const params = useParams();
  const parsed = IdParamSchema.safeParse(params[name]);
  return parsed.success ? parsed.data : null;
}
