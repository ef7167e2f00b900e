import { EMPTY_VEHICLE, VehicleForm } from './VehicleForm';
import { island } from './query-client';

function NewVehicle({ customer }: { customer: { id: string; name: string; postcode: string } | null }) {
  return (
    <VehicleForm
      initial={{ ...EMPTY_VEHICLE, customerId: customer?.id ?? '' }}
      customer={customer}
      onSaved={(id) => window.location.assign(`/office/vehicles/${id}`)}
    />
  );
}

export default island(NewVehicle);
