import { island } from './query-client';
import { CustomerForm } from './CustomerForm';

function NewCustomer() {
  return <CustomerForm onSaved={(id) => window.location.assign(`/office/customers/${id}`)} />;
}

export default island(NewCustomer);
