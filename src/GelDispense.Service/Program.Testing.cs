// Makes the implicit Program class visible to WebApplicationFactory in the service tests.
public partial class Program;
