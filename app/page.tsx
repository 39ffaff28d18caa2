export default function Home() {
  return <main className="p-8"><h1 className="text-3xl">Shuntwise</h1></main>;
}
