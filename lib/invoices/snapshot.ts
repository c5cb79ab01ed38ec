/** What an issued invoice keeps about the parties and the visit, so it never changes afterwards. */

export interface BillTo {
  accountName: string;
  address: string;
  email: string;
  phone: string;
  contactName: string;
}

export interface ShopSnapshot {
  name: string;
  addressLines: string[];
  phone: string;
  email: string;
  footer: string;
}

export interface UnitSnapshot {
  unitNumber: string;
  description: string;
  year: number | null;
  vin: string | null;
  serialNumber: string | null;
  workOrderNumber: number;
  workOrderTitle: string;
  /** The visit's three Cs as they stood when the invoice was issued (older invoices have none). */
  concerns?: ThreeCs[];
}

export interface ThreeCs {
  complaint: string;
  cause: string;
  correction: string;
}
