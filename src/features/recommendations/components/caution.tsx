import { RECOMMENDATION_CAUTION } from '../../../../shared/schemas/recommendations';
import { Alert } from '../../../components/ui/alert';

/** The caution every result that touches reserve, overload or blackout carries. */
export function Caution() {
  return (
    <Alert tone="error">
      <strong>Reserve and blackout: </strong>
      {RECOMMENDATION_CAUTION}
    </Alert>
  );
}
