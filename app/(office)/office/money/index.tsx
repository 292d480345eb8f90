import { BillingHubScreen } from "../../../../components/screens/billing/BillingHubScreen";

export default BillingHubScreen;
