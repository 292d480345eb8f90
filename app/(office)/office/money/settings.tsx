import { BillingSettingsScreen } from "../../../../components/screens/billing/BillingSettingsScreen";

export default BillingSettingsScreen;
