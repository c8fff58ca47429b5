export default function buildAddin(): Promise<void>;
