import { PayoutsScreen } from "../../../../../components/screens/billing/PayoutsScreen";

export default PayoutsScreen;
