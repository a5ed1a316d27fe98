export async function bench(): Promise<void> {
  console.log('(not measured yet)');
}
