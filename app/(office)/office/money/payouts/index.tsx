import { PayoutsScreen } from "../../../../../components/screens/billing/PayoutsScreens";

export default PayoutsScreen;
