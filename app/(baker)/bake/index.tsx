import { BakerHome } from "../../../components/screens/baker/BakerHome";

export default BakerHome;
