import { OrderHistoryScreen } from "../../../components/screens/buyer/OrderHistoryScreen";

export default OrderHistoryScreen;
